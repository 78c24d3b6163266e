import { siteRoute } from "@/lib/api/route";
import { revokeIssuing } from "@/lib/permits";

export const POST = siteRoute({ resource: "delegation", permission: "delegatePermits" }, async (ctx) => ({ delegation: await revokeIssuing(ctx) }));
