// People and roles: an admin changes someone's roles on a site, removes them from it, or
// deactivates them across the organisation. Roles are read from the database on every request,
// and deactivation bumps the session version, so a change holds from the person's next request.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { listActiveSiteAdmins, listUserRolesOnSite, setUserRolesOnSite } from "@/db/queries/memberships";
import { getOrgUser, listActiveOrgAdmins, setUserDisabled } from "@/db/queries/users";
import type { SiteRole } from "@/db/schema";
import type { Site } from "@/lib/api/resources";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import type { SessionUser } from "./index";

type Person = NonNullable<Awaited<ReturnType<typeof getOrgUser>>>;

/** The organisation's person, or 404 (a malformed id or another organisation's person alike). */
export async function findOrgPerson(user: SessionUser, userId: string): Promise<Person> {
  const person = /^[0-9a-f-]{36}$/i.test(userId) ? await getOrgUser({ userId, organisationId: user.organisationId }) : null;
  if (!person) throw new NotFoundError("That person");
  return person;
}

const LAST_ADMIN = "You are the last admin: give someone else the admin role first, so the organisation is never left without one.";

export async function setSiteRoles({ user, site, userId, roles }: { user: SessionUser; site: Site; userId: string; roles: SiteRole[] }) {
  const person = await findOrgPerson(user, userId);
  return transaction(async (tx) => {
    const before = await listUserRolesOnSite({ siteId: site.id, userId: person.id }, tx);
    if (roles.length === 0 && before.length === 0) throw new NotFoundError("That person on this site");
    if (person.id === user.id && before.includes("admin") && !roles.includes("admin") && !person.isOrgAdmin) {
      const others = (await listActiveSiteAdmins({ siteId: site.id }, tx)).filter((a) => a.id !== user.id);
      const orgAdmins = (await listActiveOrgAdmins({ organisationId: user.organisationId }, tx)).filter((a) => a.id !== user.id);
      if (others.length === 0 && orgAdmins.length === 0) throw new ConflictError(LAST_ADMIN);
    }
    await setUserRolesOnSite({ siteId: site.id, userId: person.id, roles }, tx);
    await recordAudit(
      {
        organisationId: user.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: roles.length ? "membership.roles_changed" : "membership.removed",
        entityType: "user",
        entityId: person.id,
        before: { roles: before },
        after: { roles },
      },
      tx,
    );
    return { userId: person.id, name: person.name, email: person.email, roles };
  });
}

/** Deactivate (or reactivate) a person for the whole organisation: org admins only. */
export async function setPersonActive({ user, userId, active }: { user: SessionUser; userId: string; active: boolean }) {
  const person = await findOrgPerson(user, userId);
  if (!user.isOrgAdmin) throw new ForbiddenError("Deactivating people is for organisation admins.");
  return transaction(async (tx) => {
    if (!active && person.isOrgAdmin) {
      const others = (await listActiveOrgAdmins({ organisationId: user.organisationId }, tx)).filter((a) => a.id !== person.id);
      if (others.length === 0) throw new ConflictError(person.id === user.id ? LAST_ADMIN : "This is the organisation's last admin.");
    }
    const updated = await setUserDisabled({ userId: person.id, disabled: !active }, tx);
    await recordAudit(
      {
        organisationId: user.organisationId,
        actorId: user.id,
        action: active ? "user.reactivated" : "user.deactivated",
        entityType: "user",
        entityId: person.id,
        before: { active: !person.disabledAt },
        after: { active },
      },
      tx,
    );
    return { userId: updated.id, name: updated.name, email: updated.email, active: !updated.disabledAt };
  });
}
