// The member record's first word: the state the member is in, why, and what to do next — above
// the capacity result, so a failed inspection is never read past on the way to a passing check.
import { Icon } from "@/components/icons";
import type { MemberState } from "@/lib/register/member-detail";

const TONE = {
  bad: { box: "border-bad bg-bad-soft", text: "text-bad", icon: "bad" },
  warn: { box: "border-warn bg-warn-soft", text: "text-ink", icon: "warn" },
  ok: { box: "border-ok bg-paper-raised", text: "text-ok", icon: "ok" },
  neutral: { box: "border-ink/30 bg-paper-raised", text: "text-ink", icon: "register" },
} as const;

export function MemberStateBanner({ state, inspectHref }: { state: MemberState; inspectHref: string | null }) {
  const t = TONE[state.tone];
  return (
    <section aria-labelledby="state-h" className={`break-words rounded-xl border-2 p-4 ${t.box}`} data-testid="member-state">
      <h2 id="state-h" className={`flex items-start gap-2 text-lg font-bold ${t.text}`}>
        <Icon name={t.icon} className="mt-0.5 h-6 w-6 shrink-0" />
        <span>{state.headline}</span>
      </h2>
      {state.details.length ? (
        <ul className="mt-1 flex flex-col gap-1">
          {state.details.map((d, i) => (
            <li key={i}>{d}</li>
          ))}
        </ul>
      ) : null}
      <p className="mt-2">
        <strong>What to do next:</strong> {state.nextStep}
      </p>
      {inspectHref && state.status === "out_of_service" ? (
        <a
          href={inspectHref}
          className="mt-3 inline-flex min-h-touch w-fit items-center gap-2 rounded-lg border-2 border-ink/70 bg-paper-raised px-4 font-semibold hover:bg-paper-sunk"
        >
          <Icon name="inspect" className="h-5 w-5" /> Record a re-inspection
        </a>
      ) : null}
    </section>
  );
}
