import { siteRoute } from "@/lib/api/route";
import { permitDetail, permitJson } from "@/lib/permits";

/** The permit with its members, preconditions, e-mail delivery and what the signed-in person may do. */
export const GET = siteRoute({ resource: "permit", permission: "viewSite" }, async (ctx) => ({ permit: permitJson(await permitDetail(ctx)) }));
