import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { refusePermit, loadPermitForUser, permitDetail, permitJson } from "@/lib/permits";

export const POST = apiHandler<{ permitId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  await loadPermitForUser(user, params.permitId);
  const body = await readJson(req);
  await refusePermit({ user, permitId: params.permitId, body });
  return { permit: permitJson(await permitDetail(user, params.permitId)) };
});
