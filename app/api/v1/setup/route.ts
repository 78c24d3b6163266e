import { created } from "@/lib/api";
import { publicRoute } from "@/lib/api/route";
import { createOrganisationWithAdmin } from "@/lib/auth/setup";
import { setupSchema } from "@/lib/validations/onboarding";

/** First run only: { organisationName, name, email, password } → 201; 404 once an organisation exists. */
export const POST = publicRoute({ body: setupSchema }, async ({ input }) => {
  const { organisation, user } = await createOrganisationWithAdmin(input);
  return created({ organisation: { id: organisation.id, name: organisation.name }, user: { id: user.id, email: user.email, name: user.name } });
});
