// `npm run admin:create -- --org "Name" --email a@b.example [--name "Full Name"]`: a headless
// install's first organisation and admin. No password travels on the command line: the admin
// gets a single-use link (valid 1 hour) to set one, printed here and e-mailed through the outbox.
import { parseArgs } from "node:util";
import { sql } from "@/db";
import { createOrganisationWithAdmin } from "@/lib/auth/setup";
import { hashPassword } from "@/lib/auth/password";
import { createPasswordReset } from "@/db/queries/password-resets";
import { newToken } from "@/lib/auth/tokens";
import { passwordResetUrl } from "@/lib/auth/urls";
import { AppError } from "@/lib/errors";
import { setupSchema } from "@/lib/validations/onboarding";
import { randomBytes } from "node:crypto";

const { values } = parseArgs({ options: { org: { type: "string" }, email: { type: "string" }, name: { type: "string" } } });
try {
  const parsed = setupSchema.omit({ password: true }).safeParse({ organisationName: values.org, email: values.email, name: values.name ?? values.email?.split("@")[0] });
  if (!parsed.success) {
    for (const i of parsed.error.issues) console.error(`  --${i.path[0] === "organisationName" ? "org" : String(i.path[0])}: ${i.message}`);
    console.error('usage: npm run admin:create -- --org "Organisation name" --email admin@example.com [--name "Full Name"]');
    process.exitCode = 2;
  } else {
    // An unguessable placeholder nobody knows; the admin sets their own password from the link.
    const passwordHash = await hashPassword(randomBytes(32).toString("base64url"));
    const { organisation, user } = await createOrganisationWithAdmin({ ...parsed.data, passwordHash }, { headless: true });
    const { token, hash } = newToken();
    await createPasswordReset({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + 60 * 60 * 1000) });
    console.log(`[admin:create] organisation "${organisation.name}" with admin ${user.email}`);
    console.log(`[admin:create] set the admin's password within 1 hour: ${passwordResetUrl(token)}`);
  }
} catch (e) {
  console.error(`[admin:create] ${e instanceof AppError ? e.message : String(e)}`);
  process.exitCode = 1;
} finally {
  await sql.end({ timeout: 5 });
}
