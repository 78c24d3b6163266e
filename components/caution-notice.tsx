import { CAUTION_TEXT } from "@/lib/caution";

export { CAUTION_TEXT };

/** The caution every calculation, permit and capacity screen carries. */
export function CautionNotice({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={`flex items-start gap-3 rounded-lg border-2 border-warn bg-warn-soft text-ink ${compact ? "p-2 text-sm" : "p-3 text-base"}`}
    >
      <span aria-hidden className="text-xl leading-none">
        ⚠
      </span>
      <p>
        <strong>Caution.</strong> {CAUTION_TEXT}
      </p>
    </aside>
  );
}
