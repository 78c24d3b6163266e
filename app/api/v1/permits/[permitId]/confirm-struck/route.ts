// Striking done under a permit to strike: no body (every member still standing), `{ memberIds }`
// or `{ zoneId }`; the permit closes when its last member is struck.
import { siteRoute } from "@/lib/api/route";
import { confirmStruck, permitDetail, permitJson } from "@/lib/permits";
import { confirmStruckSchema } from "@/lib/validations/permit";

export const POST = siteRoute(
  {
    resource: "permit",
    permission: "confirmStriking",
    forbidden: "Only a temporary works supervisor or the coordinator confirms that striking is done.",
    body: confirmStruckSchema,
    bodyMode: "optional-json",
  },
  async (ctx) => {
    const { struck, stillStanding } = await confirmStruck(ctx);
    return { permit: permitJson(await permitDetail(ctx)), struck, stillStanding };
  },
);
