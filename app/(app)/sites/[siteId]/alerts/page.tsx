import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { countUnreadAlerts, listSiteAlerts } from "@/db/queries/alerts";
import { formatDateTime } from "@/lib/format-date";
import { loadSitePage } from "@/lib/auth/site-page";
import { AlertKindBadge } from "./alert-kind-badge";
import { MarkAllRead, MarkRead } from "./mark-read";

export const metadata: Metadata = { title: "Alerts" };

export default async function AlertsPage({
  params, searchParams,
}: { params: Promise<{ siteId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { siteId } = await params;
  const q = await searchParams;
  const { site, user, may } = await loadSitePage(siteId);
  if (!may("viewAlerts")) return <Forbidden what="Alerts are not available to your role." />;
  const unreadOnly = q.show === "unread";
  const [items, unread] = await Promise.all([
    listSiteAlerts({ siteId: site.id, userId: user.id, unreadOnly, limit: 200 }),
    countUnreadAlerts({ siteId: site.id, userId: user.id }),
  ]);
  const base = `/sites/${site.id}/alerts`;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h1 className="text-2xl font-bold">Alerts</h1>
          <p className="text-ink-soft" data-testid="unread-count">
            {unread === 0 ? "Nothing unread." : `${unread} unread`}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {unread > 0 ? <MarkAllRead siteId={site.id} /> : null}
          <Link href={`${base}/settings`} className="flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/70 px-3 font-semibold hover:bg-paper-sunk">
            How I get alerts
          </Link>
        </div>
      </div>

      <nav aria-label="Which alerts" className="flex gap-2">
        {[
          { href: base, label: "All", active: !unreadOnly },
          { href: `${base}?show=unread`, label: `Unread (${unread})`, active: unreadOnly },
        ].map((t) => (
          <Link
            key={t.label}
            href={t.href}
            aria-current={t.active ? "page" : undefined}
            className={`flex min-h-touch items-center rounded-lg px-3 font-semibold ${t.active ? "bg-brand text-white" : "bg-paper-sunk"}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>

      {items.length === 0 ? (
        <p className="flex items-center gap-2 rounded-lg bg-ok-soft p-3 font-semibold text-ok">
          <Icon name="ok" /> {unreadOnly ? "You have read every alert." : "No alerts on this site."}
        </p>
      ) : (
        <ul className="flex flex-col gap-2">
          {items.map((a) => (
            <li
              key={a.id}
              data-testid="alert-item"
              data-read={a.read ? "true" : "false"}
              className={`flex flex-col gap-2 rounded-xl border-2 p-3 sm:flex-row sm:items-start ${a.read ? "border-ink/10 bg-paper" : "border-ink/40 bg-paper-raised"}`}
            >
              <div className="min-w-0 flex-1">
                <p className="flex flex-wrap items-center gap-2">
                  <AlertKindBadge kind={a.kind} />
                  {a.read ? (
                    <span className="inline-flex items-center gap-1 text-sm text-ink-soft">
                      <Icon name="ok" className="h-4 w-4" /> Read
                    </span>
                  ) : (
                    <span className="inline-flex items-center gap-1 rounded bg-brand px-1.5 text-sm font-bold text-white">
                      <span aria-hidden>●</span> Unread
                    </span>
                  )}
                  <span className="text-sm text-ink-soft">{formatDateTime(a.createdAt, site.timezone)}</span>
                </p>
                <p className={`mt-1 ${a.read ? "" : "font-bold"}`}>{a.title}</p>
                <p className="text-sm">{a.body}</p>
              </div>
              <div className="flex shrink-0 flex-wrap gap-2">
                {a.link ? (
                  <Link href={a.link} className="flex min-h-touch items-center rounded-lg border-2 border-ink/70 px-3 font-semibold hover:bg-paper-sunk">
                    Open
                  </Link>
                ) : null}
                {a.read ? null : <MarkRead alertId={a.id} title={a.title} />}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
