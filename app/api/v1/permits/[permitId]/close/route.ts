import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { closePermit, permitDetail, permitJson } from "@/lib/permits";

export const POST = apiHandler<{ permitId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  await closePermit({ user, permitId: params.permitId });
  return { permit: permitJson(await permitDetail(user, params.permitId)) };
});
