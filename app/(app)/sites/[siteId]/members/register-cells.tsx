// Small pieces the register's table and cards share: utilisation in colour, a bar and an arrow.
import type { MemberListItem } from "@/db/queries/member-list";

export function utilClass(item: Pick<MemberListItem, "pass" | "utilisation">) {
  if (item.pass === false) return "text-bad font-bold";
  if (item.utilisation !== null && item.utilisation > 0.9) return "text-warn font-semibold";
  return "";
}

export function UtilBar({ u }: { u: number | null }) {
  if (u === null) return null;
  const pct = Math.min(100, Math.max(0, u * 100));
  const colour = u > 1 ? "bg-bad" : u > 0.9 ? "bg-warn" : "bg-ok";
  return (
    <span aria-hidden className="ml-1.5 inline-block h-1.5 w-8 overflow-hidden 2xl:w-12 rounded bg-paper-sunk align-middle print:hidden">
      <span className={`block h-full ${colour}`} style={{ width: `${pct}%` }} />
    </span>
  );
}

export function SortIcon({ dir }: { dir: false | "asc" | "desc" }) {
  return (
    <span aria-hidden className={`text-xs ${dir ? "text-ink" : "text-ink-faint"} print:hidden`}>
      {dir === "asc" ? "▲" : dir === "desc" ? "▼" : "↕"}
    </span>
  );
}
