import { listUserSites } from "@/db/queries/users";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";

export const GET = apiHandler(async () => {
  const user = await requireApiUser();
  const sites = await listUserSites({ user });
  return { items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, address: s.address, roles: s.roles })) };
});
