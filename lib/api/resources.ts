// How a route finds the record it acts on. Each loader answers 404 for a malformed id, a record
// of another organisation, or one on a site the user holds no role on, so nothing reveals that
// such a record exists. Add a kind here when a route acts on a new kind of record.
import "server-only";
import { getAlertForUser } from "@/db/queries/alerts";
import { getMemberForUser } from "@/db/queries/members";
import { getDelegationForUser, getPermitForUser } from "@/db/queries/permits";
import { getPhotoForUser } from "@/db/queries/photos";
import { getScheme } from "@/db/queries/schemes";
import { getSiteAccessRow } from "@/db/queries/sites";
import type { SessionUser } from "@/db/queries/users";
import type { SiteRole } from "@/db/schema";
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
  scheme: {
    param: "schemeId",
    async load(user: SessionUser, params: Record<string, string>) {
      const siteId = idOr404(params, "siteId", "That scheme");
      const schemeId = idOr404(params, "schemeId", "That scheme");
      const access = await accessOr404(user, siteId, "That scheme");
      const scheme = await getScheme({ siteId, schemeId });
      if (!scheme) throw new NotFoundError("That scheme");
      return { ...access, resource: scheme };
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
} as const;

export type ResourceKind = keyof typeof RESOURCES;
export type ResourceOf<K extends ResourceKind> = Awaited<ReturnType<(typeof RESOURCES)[K]["load"]>>["resource"];
