import { siteRoute } from "@/lib/api/route";
import { mayDecide, permitDetail, permitJson, refusePermit } from "@/lib/permits";
import { permitReasonSchema } from "@/lib/validations/permit";

export const POST = siteRoute({ resource: "permit", permission: "viewSite", authorize: mayDecide, body: permitReasonSchema }, async (ctx) => {
  await refusePermit(ctx);
  return { permit: permitJson(await permitDetail(ctx)) };
});
