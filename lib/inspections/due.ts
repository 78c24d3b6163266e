// When a member's next inspection is due, and in what words. Pure, so the round page, the
// alert scan and the unit tests agree.
const DAY_MS = 24 * 3600_000;
/** "Due soon" means due within this long. */
export const DUE_SOON_MS = DAY_MS;

export type InspectionState = "never" | "failed" | "due_now" | "overdue" | "due_soon" | "in_date";

export type DueInput = {
  lastResult: "pass" | "fail" | null;
  lastInspectedAt: Date | null;
  nextDueAt: Date | null;
  /** The first coordinator trigger covering the member since its last inspection. */
  triggeredAt: Date | null;
};

export type DueOutcome = { state: InspectionState; dueAt: Date | null; cause: "interval" | "trigger" | null };

export function nextDueFrom(inspectedAt: Date, intervalDays: number): Date {
  return new Date(inspectedAt.getTime() + intervalDays * DAY_MS);
}

export function inspectionState(m: DueInput, now: Date, intervalDays: number): DueOutcome {
  if (!m.lastInspectedAt || !m.lastResult) return { state: "never", dueAt: m.triggeredAt, cause: m.triggeredAt ? "trigger" : null };
  if (m.lastResult === "fail") return { state: "failed", dueAt: m.lastInspectedAt, cause: null };
  const byInterval = m.nextDueAt ?? nextDueFrom(m.lastInspectedAt, intervalDays);
  if (m.triggeredAt && m.triggeredAt < byInterval) {
    return { state: m.triggeredAt <= now ? "due_now" : "in_date", dueAt: m.triggeredAt, cause: "trigger" };
  }
  const t = byInterval.getTime() - now.getTime();
  const state: InspectionState = t <= 0 ? "overdue" : t <= DUE_SOON_MS ? "due_soon" : "in_date";
  return { state, dueAt: byInterval, cause: "interval" };
}

export const INSPECTION_STATE_LABELS: Record<InspectionState, string> = {
  never: "Not inspected yet",
  failed: "Failed — awaiting re-inspection",
  due_now: "Due now",
  overdue: "Overdue",
  due_soon: "Due soon",
  in_date: "In date",
};

/** Order on the round: what needs doing first. */
export const INSPECTION_STATE_ORDER: InspectionState[] = ["overdue", "due_now", "failed", "never", "due_soon", "in_date"];

/** The states the round lists under "To inspect" (the rest are in date). */
export const NEEDS_DOING: InspectionState[] = ["overdue", "due_now", "failed", "never", "due_soon"];

/** The round in the order it is walked: what needs doing first, then by due date, then by tag. */
export function orderRound<T extends DueInput & { tag: string; inspectionIntervalDays: number }>(rows: T[], now: Date): (T & { due: DueOutcome })[] {
  return rows
    .map((r) => ({ ...r, due: inspectionState(r, now, r.inspectionIntervalDays) }))
    .sort(
      (a, b) =>
        INSPECTION_STATE_ORDER.indexOf(a.due.state) - INSPECTION_STATE_ORDER.indexOf(b.due.state) ||
        (a.due.dueAt?.getTime() ?? 0) - (b.due.dueAt?.getTime() ?? 0) ||
        a.tag.localeCompare(b.tag),
    );
}
