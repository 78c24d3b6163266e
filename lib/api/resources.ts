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
import type { SessionAccess, SessionUser } from "@/db/queries/users";
import type { SiteRole } from "@/db/schema";
import { getZone } from "@/db/queries/zones";
import { isUuid, siteAccessOr404 } from "@/lib/authz";
import { NotFoundError } from "@/lib/errors";

export type SiteAccess = NonNullable<Awaited<ReturnType<typeof getSiteAccessRow>>>;
export type Site = SiteAccess["site"];

/**
 * The access to one site already read with the session in the same request (the seam reads the
 * path's siteId with the session: one round trip, see getSessionUserAt); a loader uses it when
 * the record's site is that site and asks the database otherwise.
 */
export type KnownAccess = { siteId: string; access: SessionAccess | null };

async function accessOr404(user: SessionUser, siteId: string, what: string, known?: KnownAccess): Promise<SiteAccess> {
  const access = known && known.siteId === siteId ? known.access : await getSiteAccessRow({ siteId, user });
  return siteAccessOr404(access, what);
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
  known?: KnownAccess,
): Promise<Loaded<R>> {
  const siteId = idOr404(params, "siteId", "That site");
  const access = await accessOr404(user, siteId, "That site", known);
  const id = idOr404(params, param, what);
  const resource = await find(access.site, id);
  if (!resource) throw new NotFoundError(what);
  return { ...access, resource };
}

/** Each loader: the path parameter it reads, and how it finds the record and its site. */
export const RESOURCES = {
  site: {
    param: "siteId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess): Promise<Loaded<Site>> {
      const siteId = idOr404(params, "siteId", "That site");
      const access = await accessOr404(user, siteId, "That site", known);
      return { ...access, resource: access.site };
    },
  },
  member: {
    param: "memberId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const memberId = idOr404(params, "memberId", "That member");
      const member = await getMemberForUser({ memberId, organisationId: user.organisationId });
      if (!member) throw new NotFoundError("That member");
      const access = await accessOr404(user, member.siteId, "That member", known);
      return { ...access, resource: member };
    },
  },
  permit: {
    param: "permitId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const permitId = idOr404(params, "permitId", "That permit");
      const permit = await getPermitForUser({ permitId, organisationId: user.organisationId });
      if (!permit) throw new NotFoundError("That permit");
      const access = await accessOr404(user, permit.siteId, "That permit", known);
      return { ...access, resource: permit };
    },
  },
  photo: {
    param: "photoId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const photoId = idOr404(params, "photoId", "That photo");
      const photo = await getPhotoForUser({ photoId, organisationId: user.organisationId });
      if (!photo) throw new NotFoundError("That photo");
      const access = await accessOr404(user, photo.siteId, "That photo", known);
      return { ...access, resource: photo };
    },
  },
  delegation: {
    param: "delegationId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const delegationId = idOr404(params, "delegationId", "That issuing scope");
      const delegation = await getDelegationForUser({ delegationId, organisationId: user.organisationId });
      if (!delegation) throw new NotFoundError("That issuing scope");
      const access = await accessOr404(user, delegation.siteId, "That issuing scope", known);
      return { ...access, resource: delegation };
    },
  },
  alert: {
    param: "alertId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const alertId = idOr404(params, "alertId", "That alert");
      const alert = await getAlertForUser({ alertId, organisationId: user.organisationId });
      if (!alert) throw new NotFoundError("That alert");
      const access = await accessOr404(user, alert.siteId, "That alert", known);
      return { ...access, resource: alert };
    },
  },
  zone: {
    param: "zoneId",
    load: (user: SessionUser, params: Record<string, string>, known?: KnownAccess) =>
      onSite(user, params, "zoneId", "That zone", (site, zoneId) => getZone({ siteId: site.id, zoneId }), known),
  },
  scheme: {
    param: "schemeId",
    load: (user: SessionUser, params: Record<string, string>, known?: KnownAccess) =>
      onSite(user, params, "schemeId", "That scheme", (site, schemeId) => getScheme({ siteId: site.id, schemeId }), known),
  },
  /** A type of the site's organisation library (archived ones too: they can still be edited or deleted). */
  memberType: {
    param: "typeId",
    load: (user: SessionUser, params: Record<string, string>, known?: KnownAccess) =>
      onSite(user, params, "typeId", "That member type", (site, memberTypeId) =>
        getMemberType({ organisationId: site.organisationId, memberTypeId, includeArchived: true }),
      known),
  },
  invitation: {
    param: "invitationId",
    async load(user: SessionUser, params: Record<string, string>, known?: KnownAccess) {
      const invitationId = idOr404(params, "invitationId", "That invitation");
      const invitation = await getInvitationForOrg({ invitationId, organisationId: user.organisationId });
      if (!invitation?.siteId || (params.siteId !== undefined && params.siteId !== invitation.siteId)) throw new NotFoundError("That invitation");
      const access = await accessOr404(user, invitation.siteId, "That invitation", known);
      return { ...access, resource: invitation };
    },
  },
} as const;

export type ResourceKind = keyof typeof RESOURCES;
export type ResourceOf<K extends ResourceKind> = Awaited<ReturnType<(typeof RESOURCES)[K]["load"]>>["resource"];
