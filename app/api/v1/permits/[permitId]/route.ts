import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { permitDetail, permitJson } from "@/lib/permits";

export const GET = apiHandler<{ permitId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  return { permit: permitJson(await permitDetail(user, params.permitId)) };
});
