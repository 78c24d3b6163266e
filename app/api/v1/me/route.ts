import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";

export const GET = apiHandler(async () => {
  const user = await requireApiUser();
  return { user };
});
