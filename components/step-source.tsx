// The working's source cell (calculator and member page): the standard and clause, then in their own
// words a note (a rule of thumb, the range a value was taken from) and, flagged, what a value awaits
// confirmation against, so a checker sees at a glance which numbers to look up.
import { Icon } from "@/components/icons";
import type { Step } from "@/lib/engineering";

const sentence = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

export function StepSource({ step }: { step: Pick<Step, "source" | "toConfirm" | "note"> }) {
  return (
    <>
      <span className="block" data-part="source">{step.source}</span>
      {step.note ? <span className="block text-xs" data-part="note">{sentence(step.note)}</span> : null}
      {step.toConfirm ? (
        <span className="mt-0.5 flex items-start gap-1 font-semibold text-warn" data-part="to-confirm">
          <Icon name="warn" className="mt-0.5 h-4 w-4 shrink-0" />
          <span>{sentence(step.toConfirm)}</span>
        </span>
      ) : null}
    </>
  );
}
