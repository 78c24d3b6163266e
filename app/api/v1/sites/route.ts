import { listUserSites } from "@/db/queries/users";
import { userRoute } from "@/lib/api/route";

/** The sites the signed-in person can see, with their roles on each. */
export const GET = userRoute({}, async ({ user }) => {
  const sites = await listUserSites({ user });
  return { items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, address: s.address, roles: s.roles })) };
});
