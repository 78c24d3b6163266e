// The site overview's "overloaded now" panel: members whose latest check fails, worst first.
import Link from "next/link";
import { Icon } from "@/components/icons";
import { countUnreadAlerts, listCurrentOverloads } from "@/db/queries/alerts";
import { countFailingNow } from "@/db/queries/member-history";
import { formatKn, formatPercent } from "@/lib/alerts/format";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";

export async function OverloadSummary({ siteId, userId }: { siteId: string; userId: string }) {
  // The list shows the worst few; the count is every member failing now (the same rule as the overview's count).
  const [rows, total, unread] = await Promise.all([listCurrentOverloads({ siteId }), countFailingNow({ siteId }), countUnreadAlerts({ siteId, userId })]);
  return (
    <section aria-labelledby="overloads-h" className={`rounded-xl border-2 p-4 ${rows.length ? "border-bad bg-bad-soft" : "border-ink/15 bg-paper-raised"}`} data-testid="overload-summary">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h2 id="overloads-h" className="flex items-center gap-2 text-lg font-bold">
          <Icon name={rows.length ? "bad" : "ok"} className={`h-6 w-6 ${rows.length ? "text-bad" : "text-ok"}`} />
          {total ? `Overloaded now: ${total} member${total === 1 ? "" : "s"}` : "No member is overloaded"}
        </h2>
        <Link href={`/sites/${siteId}/alerts`} className="flex min-h-touch items-center gap-1 font-semibold text-brand underline">
          <Icon name="alert" className="h-5 w-5" /> Alerts{unread ? ` (${unread} unread)` : ""}
        </Link>
      </div>
      {rows.length ? (
        <ul className="flex flex-col gap-1">
          {rows.slice(0, 8).map((m) => (
            <li key={m.memberId}>
              <Link href={`/sites/${siteId}/members/${m.memberId}`} className="flex min-h-touch flex-wrap items-center gap-x-3 rounded-lg bg-paper-raised px-3 py-1 hover:bg-paper-sunk">
                <span className="font-bold">{m.tag}</span>
                <span className="tabular font-semibold text-bad">
                  {m.capacityN == null ? "cannot be checked at this extension" : `utilisation ${formatPercent(m.utilisation)}`}
                </span>
                <span className="tabular text-sm text-ink-soft">
                  {formatKn(m.loadN)} on {formatKn(m.capacityN)} · {Math.round(m.extensionMm)} mm · {MEMBER_STATUS_LABELS[m.status]}
                </span>
              </Link>
            </li>
          ))}
          {total > 8 ? <li className="text-sm">…and {total - 8} more in the register.</li> : null}
        </ul>
      ) : null}
    </section>
  );
}
