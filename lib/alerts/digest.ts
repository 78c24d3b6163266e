// The daily digest: one e-mail per person who chose "digest" for some kind of alert, listing the
// alerts of those kinds raised in the last 24 hours on their sites. Once per person per day,
// even if two workers run it (an advisory lock and the outbox row it leaves behind).
import "server-only";
import { transaction } from "@/db";
import {
  advisoryXactLock, digestAlreadyQueued, listAlertsBetween, listDigestUsers, listPreferences, listUserSiteRoles,
} from "@/db/queries/alerts";
import { enqueueEmails } from "@/db/queries/outbox";
import type { SiteRole } from "@/db/schema";
import { renderAlertDigest } from "@/emails/alert-digest";
import { env } from "@/lib/env";
import { ALERT_KIND_LABELS, deliveryFor, isAlertKind, type Delivery } from "./kinds";

const DAY_MS = 24 * 3600_000;

export async function sendDailyDigests({ now = new Date(), userIds }: { now?: Date; userIds?: string[] } = {}) {
  const day = now.toISOString().slice(0, 10);
  const kind = `alert:digest:${day}`;
  let queued = 0;
  const people = (await listDigestUsers()).filter((u) => !userIds || userIds.includes(u.userId));
  for (const person of people) {
    queued += await transaction(async (tx) => {
      await advisoryXactLock(`digest:${person.userId}:${day}`, tx);
      if (await digestAlreadyQueued({ userId: person.userId, kind }, tx)) return 0;
      const prefs = new Map((await listPreferences({ userIds: [person.userId] }, tx)).map((p) => [p.kind, p.delivery as Delivery]));
      const rolesBySite = new Map<string, SiteRole[]>();
      for (const r of await listUserSiteRoles({ userId: person.userId }, tx)) rolesBySite.set(r.siteId, [...(rolesBySite.get(r.siteId) ?? []), r.role]);
      const rows = await listAlertsBetween({ siteIds: [...rolesBySite.keys()], from: new Date(now.getTime() - DAY_MS), to: now }, tx);
      const items = rows
        .filter(({ alert }) => isAlertKind(alert.kind) && deliveryFor(alert.kind, rolesBySite.get(alert.siteId) ?? [], prefs.get(alert.kind)) === "digest")
        .map(({ alert, siteName }) => ({ siteName, kindLabel: ALERT_KIND_LABELS[alert.kind as keyof typeof ALERT_KIND_LABELS], title: alert.title }));
      if (items.length === 0) return 0;
      const mail = renderAlertDigest({ name: person.name, day, items, link: new URL("/sites", env.APP_URL).toString() });
      await enqueueEmails([{ kind, toEmail: person.email, toUserId: person.userId, subject: mail.subject, text: mail.text, html: mail.html, relatedType: "digest" }], tx);
      return 1;
    });
  }
  return queued;
}
