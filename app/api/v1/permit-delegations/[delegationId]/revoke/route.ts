import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { revokeIssuing } from "@/lib/permits";

export const POST = apiHandler<{ delegationId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  return { delegation: await revokeIssuing({ user, delegationId: params.delegationId }) };
});
