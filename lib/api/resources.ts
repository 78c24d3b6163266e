// How a route finds the record it acts on. Each loader answers 404 for a malformed id, a record
// of another organisation, or one on a site the user holds no role on, so nothing reveals that
// such a record exists. Add a kind here when a route acts on a new kind of record.
import "server-only";
import { getAlertForUser } from "@/db/queries/alerts";
import { getMemberType } from "@/db/queries/member-types";
import { getInvitationForOrg } from "@/db/queries/invitations";
import { getMemberForUser } from "@/db/queries/members";
import { getDelegationForUser, getPermitForUser } from "@/db/queries/permits";
import { getPhotoForUser } from "@/db/queries/photos";
import { getScheme } from "@/db/queries/schemes";
import { getSiteAccessRow } from "@/db/queries/sites";
import type { SessionUser } from "@/db/queries/users";
import type { SiteRole } from "@/db/schema";
import { getZone } from "@/db/queries/zones";
import { isUuid } from "@/lib/authz";
import { NotFoundError } from "@/lib/errors";

export type SiteAccess = NonNullable<Awaited<ReturnType<typeof getSiteAccessRow>>>;
export type Site = SiteAccess["site"];

async function accessOr404(user: SessionUser, siteId: string, what: string): Promise<SiteAccess> {
  const access = await getSiteAccessRow({ siteId, user });
  if (!access || access.roles.length === 0) throw new NotFoundError(what);
  return access;
}

function idOr404(params: Record<string, string>, name: string, what: string): string {
  const id = params[name];
  if (!isUuid(id)) throw new NotFoundError(what);
  return id;
}

type Loaded<R> = { site: Site; roles: SiteRole[]; resource: R };

/** A record that lives under a site in the path (sites/{siteId}/zones/{zoneId}): the site first, then the record on it. */
async function onSite<R>(
  user: SessionUser,
  params: Record<string, string>,
  param: string,
  what: string,
  find: (site: Site, id: string) => Promise<R | null>,
): Promise<Loaded<R>> {
  const siteId = idOr404(params, "siteId", "That site");
  const access = await accessOr404(user, siteId, "That site");
  const id = idOr404(params, param, what);
  const resource = await find(access.site, id);
  if (!resource) throw new NotFoundError(what);
  return { ...access, resource };
}

/** Each loader: the path parameter it reads, and how it finds the record and its site. */
export const RESOURCES = {
  site: {
    param: "siteId",
    async load(user: SessionUser, params: Record<string, string>): Promise<Loaded<Site>> {
      const siteId = idOr404(params, "siteId", "That site");
      const access = await accessOr404(user, siteId, "That site");
      return { ...access, resource: access.site };
    },
  },
  member: {
    param: "memberId",
    async load(user: SessionUser, params: Record<string, string>) {
      const memberId = idOr404(params, "memberId", "That member");
      const member = await getMemberForUser({ memberId, organisationId: user.organisationId });
      if (!member) throw new NotFoundError("That member");
      const access = await accessOr404(user, member.siteId, "That member");
      return { ...access, resource: member };
    },
  },
  permit: {
    param: "permitId",
    async load(user: SessionUser, params: Record<string, string>) {
      const permitId = idOr404(params, "permitId", "That permit");
      const permit = await getPermitForUser({ permitId, organisationId: user.organisationId });
      if (!permit) throw new NotFoundError("That permit");
      const access = await accessOr404(user, permit.siteId, "That permit");
      return { ...access, resource: permit };
    },
  },
  photo: {
    param: "photoId",
    async load(user: SessionUser, params: Record<string, string>) {
      const photoId = idOr404(params, "photoId", "That photo");
      const photo = await getPhotoForUser({ photoId, organisationId: user.organisationId });
      if (!photo) throw new NotFoundError("That photo");
      const access = await accessOr404(user, photo.siteId, "That photo");
      return { ...access, resource: photo };
    },
  },
  delegation: {
    param: "delegationId",
    async load(user: SessionUser, params: Record<string, string>) {
      const delegationId = idOr404(params, "delegationId", "That issuing scope");
      const delegation = await getDelegationForUser({ delegationId, organisationId: user.organisationId });
      if (!delegation) throw new NotFoundError("That issuing scope");
      const access = await accessOr404(user, delegation.siteId, "That issuing scope");
      return { ...access, resource: delegation };
    },
  },
  alert: {
    param: "alertId",
    async load(user: SessionUser, params: Record<string, string>) {
      const alertId = idOr404(params, "alertId", "That alert");
      const alert = await getAlertForUser({ alertId, organisationId: user.organisationId });
      if (!alert) throw new NotFoundError("That alert");
      const access = await accessOr404(user, alert.siteId, "That alert");
      return { ...access, resource: alert };
    },
  },
  zone: {
    param: "zoneId",
    load: (user: SessionUser, params: Record<string, string>) =>
      onSite(user, params, "zoneId", "That zone", (site, zoneId) => getZone({ siteId: site.id, zoneId })),
  },
  scheme: {
    param: "schemeId",
    load: (user: SessionUser, params: Record<string, string>) =>
      onSite(user, params, "schemeId", "That scheme", (site, schemeId) => getScheme({ siteId: site.id, schemeId })),
  },
  /** A type of the site's organisation library (archived ones too: they can still be edited or deleted). */
  memberType: {
    param: "typeId",
    load: (user: SessionUser, params: Record<string, string>) =>
      onSite(user, params, "typeId", "That member type", (site, memberTypeId) =>
        getMemberType({ organisationId: site.organisationId, memberTypeId, includeArchived: true }),
      ),
  },
  invitation: {
    param: "invitationId",
    async load(user: SessionUser, params: Record<string, string>) {
      const invitationId = idOr404(params, "invitationId", "That invitation");
      const invitation = await getInvitationForOrg({ invitationId, organisationId: user.organisationId });
      if (!invitation?.siteId || (params.siteId !== undefined && params.siteId !== invitation.siteId)) throw new NotFoundError("That invitation");
      const access = await accessOr404(user, invitation.siteId, "That invitation");
      return { ...access, resource: invitation };
    },
  },
} as const;

export type ResourceKind = keyof typeof RESOURCES;
export type ResourceOf<K extends ResourceKind> = Awaited<ReturnType<(typeof RESOURCES)[K]["load"]>>["resource"];
