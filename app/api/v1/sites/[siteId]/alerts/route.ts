import { countUnreadAlerts, listSiteAlerts } from "@/db/queries/alerts";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { ValidationError } from "@/lib/errors";

/** The site's alerts, newest first, each with whether the signed-in person has read it. `?unread=true` for unread only. */
export const GET = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const { site } = await assertSitePermission(user, params.siteId, "viewAlerts");
  const q = new URL(req.url).searchParams;
  const unread = q.get("unread");
  if (unread != null && unread !== "true" && unread !== "false") throw new ValidationError({ unread: "unread must be true or false." });
  const limitRaw = q.get("limit");
  const limit = limitRaw == null ? 100 : Number(limitRaw);
  if (!Number.isInteger(limit) || limit < 1 || limit > 500) throw new ValidationError({ limit: "limit must be a whole number from 1 to 500." });
  const [items, unreadCount] = await Promise.all([
    listSiteAlerts({ siteId: site.id, userId: user.id, unreadOnly: unread === "true", limit }),
    countUnreadAlerts({ siteId: site.id, userId: user.id }),
  ]);
  return { items, unread: unreadCount };
});
