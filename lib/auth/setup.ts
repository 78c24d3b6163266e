// First run: an empty installation gets its organisation and first admin, once.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { countOrganisations, createOrganisation, createUser, getUserByEmail, lockSetup } from "@/db/queries/users";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import type { SetupInput } from "@/lib/validations/onboarding";
import { hashPassword } from "./password";
import { passwordProblem } from "./password-policy";

export async function setupNeeded() {
  return (await countOrganisations()) === 0;
}

function slugFor(name: string) {
  const s = name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 40);
  return s || "organisation";
}

/**
 * Creates the organisation and its first admin. `headless` (npm run admin:create) may also add
 * further organisations to an installation; the web page only works while there is none (404).
 */
export async function createOrganisationWithAdmin(
  input: Omit<SetupInput, "password"> & { passwordHash?: string; password?: string },
  { headless = false }: { headless?: boolean } = {},
) {
  if (input.password !== undefined) {
    const problem = passwordProblem(input.password, [input.name, input.email, input.organisationName]);
    if (problem) throw new ValidationError({ password: problem });
  }
  const passwordHash = input.passwordHash ?? (await hashPassword(input.password!));
  return transaction(async (tx) => {
    await lockSetup(tx);
    if (!headless && (await countOrganisations(tx)) > 0) throw new NotFoundError("The setup page");
    if (await getUserByEmail({ email: input.email }, tx))
      throw new ConflictError("An account with that e-mail address already exists.", { email: "An account with that e-mail address already exists." });
    const base = slugFor(input.organisationName);
    const slug = headless ? `${base}-${Date.now().toString(36)}` : base;
    const org = await createOrganisation({ name: input.organisationName, slug }, tx);
    const user = await createUser({ organisationId: org.id, email: input.email, name: input.name, passwordHash, isOrgAdmin: true }, tx);
    await recordAudit({ organisationId: org.id, actorId: user.id, action: "organisation.created", entityType: "organisation", entityId: org.id, after: { name: org.name, via: headless ? "admin:create" : "setup" } }, tx);
    await recordAudit({ organisationId: org.id, actorId: user.id, action: "user.created", entityType: "user", entityId: user.id, after: { email: user.email, name: user.name, isOrgAdmin: true } }, tx);
    return { organisation: org, user };
  });
}
