// Raises alerts: each fires once per (kind, subject, threshold), and the people it concerns are
// e-mailed through the outbox in the same transaction, so an alert and its e-mails exist together
// or not at all. Several alerts of one kind on one site raised together make one e-mail each.
import "server-only";
import type { DbOrTx } from "@/db";
import { insertNewAlerts, listPreferences, listSitePeopleWithRoles, listSiteNames, type AlertRow, type NewAlert } from "@/db/queries/alerts";
import { enqueueEmails, type NewEmail } from "@/db/queries/outbox";
import type { SiteRole } from "@/db/schema";
import { renderAlertEmail } from "@/emails/alert-email";
import { env } from "@/lib/env";
import { ALERT_KIND_LABELS, ALERT_KINDS, ALERT_RECIPIENT_ROLES, deliveryFor, isAlertKind, type AlertKind, type Delivery } from "./kinds";

export type AlertCandidate = NewAlert & { kind: AlertKind };

export type RaiseReport = { raised: AlertRow[]; emails: number };

export async function raiseAlerts(candidates: AlertCandidate[], tx: DbOrTx): Promise<RaiseReport> {
  const raised = await insertNewAlerts(candidates, tx);
  if (raised.length === 0) return { raised, emails: 0 };

  const siteIds = [...new Set(raised.map((a) => a.siteId))];
  const roles = [...new Set(ALERT_KINDS.flatMap((k) => ALERT_RECIPIENT_ROLES[k]))];
  const people = await listSitePeopleWithRoles({ siteIds, roles }, tx);
  const prefs = await listPreferences({ userIds: [...new Set(people.map((p) => p.userId))] }, tx);
  const siteNames = await listSiteNames({ siteIds }, tx);

  const prefOf = new Map(prefs.map((p) => [`${p.userId}:${p.kind}`, p.delivery as Delivery]));
  // user × site → roles and address
  const holders = new Map<string, { userId: string; email: string; siteId: string; roles: SiteRole[] }>();
  for (const p of people) {
    const key = `${p.userId}:${p.siteId}`;
    const h = holders.get(key) ?? { userId: p.userId, email: p.email, siteId: p.siteId, roles: [] };
    h.roles.push(p.role);
    holders.set(key, h);
  }

  // (user, site, kind) → alerts to e-mail now
  const groups = new Map<string, { userId: string; email: string; siteId: string; kind: AlertKind; alerts: AlertRow[] }>();
  for (const a of raised) {
    if (!isAlertKind(a.kind)) continue;
    for (const h of holders.values()) {
      if (h.siteId !== a.siteId) continue;
      if (deliveryFor(a.kind, h.roles, prefOf.get(`${h.userId}:${a.kind}`)) !== "immediate") continue;
      const key = `${h.userId}:${a.siteId}:${a.kind}`;
      const g = groups.get(key) ?? { userId: h.userId, email: h.email, siteId: a.siteId, kind: a.kind, alerts: [] };
      g.alerts.push(a);
      groups.set(key, g);
    }
  }

  const messages: NewEmail[] = [...groups.values()].map((g) => {
    const siteName = siteNames.get(g.siteId)?.name ?? "your site";
    const content = renderAlertEmail(
      g.alerts.map((a) => ({ title: a.title, body: a.body, link: a.link, siteName, kindLabel: ALERT_KIND_LABELS[g.kind] })),
      { appUrl: env.APP_URL, alertsPath: `/sites/${g.siteId}/alerts` },
    );
    return {
      siteId: g.siteId,
      kind: `alert:${g.kind}`,
      toEmail: g.email,
      toUserId: g.userId,
      subject: content.subject,
      text: content.text,
      html: content.html,
      relatedType: "alert",
      relatedId: g.alerts[0]!.id,
    };
  });
  await enqueueEmails(messages, tx);
  return { raised, emails: messages.length };
}
