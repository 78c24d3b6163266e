import { siteRoute } from "@/lib/api/route";
import { closePermit, mayDecide, permitDetail, permitJson } from "@/lib/permits";

export const POST = siteRoute({ resource: "permit", permission: "viewSite", authorize: mayDecide }, async (ctx) => {
  await closePermit(ctx);
  return { permit: permitJson(await permitDetail(ctx)) };
});
