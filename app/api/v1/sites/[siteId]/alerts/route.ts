import { countUnreadAlerts, listSiteAlerts } from "@/db/queries/alerts";
import { siteRoute } from "@/lib/api/route";
import { ValidationError } from "@/lib/errors";

function one(v: string | string[] | undefined): string | undefined {
  return Array.isArray(v) ? v[v.length - 1] : v;
}

/** `?unread=true|false&limit=1..500`, with a sentence per field when either is wrong. */
function alertsQuery(raw: unknown) {
  const q = raw as Record<string, string | string[] | undefined>;
  const unread = one(q.unread);
  if (unread != null && unread !== "true" && unread !== "false") throw new ValidationError({ unread: "Unread only must be true or false." });
  const limitRaw = one(q.limit);
  const limit = limitRaw == null ? 100 : Number(limitRaw);
  if (!Number.isInteger(limit) || limit < 1 || limit > 500) throw new ValidationError({ limit: "The number of alerts to list must be a whole number from 1 to 500." });
  return { unreadOnly: unread === "true", limit };
}

/** The site's alerts, newest first, each with whether the signed-in person has read it. `?unread=true` for unread only. */
export const GET = siteRoute({ resource: "site", permission: "viewAlerts", query: alertsQuery }, async ({ user, site, query }) => {
  const [items, unreadCount] = await Promise.all([
    listSiteAlerts({ siteId: site.id, userId: user.id, unreadOnly: query.unreadOnly, limit: query.limit }),
    countUnreadAlerts({ siteId: site.id, userId: user.id }),
  ]);
  return { items, unread: unreadCount };
});
