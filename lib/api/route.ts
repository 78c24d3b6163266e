// The one seam for every route handler. A route declares who may call it, the record it acts on
// and the shape of its input; this wrapper answers in the house order — 401 not signed in → 404
// not found or not yours → 403 role not allowed → 422 bad input — and hands the use case a typed
// context. Use cases take that context and never re-derive access.
import "server-only";
import "@/lib/validations/messages";
import type { z } from "zod";
import type { SiteRole } from "@/db/schema";
import { listUserSites } from "@/db/queries/users";
import { requireApiSession, requireApiUser, type SessionUser } from "@/lib/auth";
import { isUuid } from "@/lib/authz";
import { ConflictError, fieldErrorsFromZod, ForbiddenError, ValidationError } from "@/lib/errors";
import { rolesAllowPure, type PermissionName } from "@/lib/permissions";
import { apiHandler } from "./index";
import { RESOURCES, type ResourceKind, type ResourceOf, type Site } from "./resources";

/** A zod schema, or a function that parses and throws ValidationError itself (custom messages). */
export type Parser<T = unknown> = z.ZodType<T> | ((raw: unknown) => T);
type Parsed<P> = P extends z.ZodType ? z.output<P> : P extends (raw: unknown) => infer T ? T : undefined;

function runParser<T>(parser: Parser<T>, raw: unknown): T {
  if (typeof parser === "function") return parser(raw);
  const r = parser.safeParse(raw);
  if (!r.success) throw new ValidationError(fieldErrorsFromZod(r.error.issues));
  return r.data;
}

/** A JSON object body; `optional` lets an empty body stand for `{}`. Anything else is a 422. */
async function readJsonObject(req: Request, optional: boolean): Promise<Record<string, unknown>> {
  const text = await req.text();
  if (!text.trim()) {
    if (optional) return {};
    throw new ValidationError({ _: "The request body must be JSON." }, "The request body must be JSON.");
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new ValidationError({ _: "The request body must be JSON." }, "The request body must be JSON.");
  }
  if (!body || typeof body !== "object" || Array.isArray(body))
    throw new ValidationError({ _: "The request body must be a JSON object." }, "The request body must be a JSON object.");
  return body as Record<string, unknown>;
}

/**
 * A route without a body schema ignores what it is sent, but a body that is not JSON at all is bad
 * input (422, nothing done) rather than silently dropped. Empty bodies and `{}` are fine.
 */
async function refuseNonJsonBody(req: Request): Promise<void> {
  if (req.method === "GET" || req.method === "HEAD") return;
  const text = await req.text();
  if (!text.trim()) return;
  try {
    JSON.parse(text);
  } catch {
    throw new ValidationError({ _: "The request body must be JSON (or empty)." }, "The request body must be JSON (or empty).");
  }
}

/** Reads the body as the route declared it (after the role check, so a refused caller's body is never read). */
async function readBody<T>(req: Request, parser: Parser<T> | undefined, bodyMode: RouteMeta["body"]): Promise<T | undefined> {
  if (bodyMode === "raw") return undefined;
  if (bodyMode === "none" || !parser) {
    await refuseNonJsonBody(req);
    return undefined;
  }
  return runParser(parser, await readJsonObject(req, bodyMode === "optional-json"));
}

/** Query strings are read as an object of strings; a key given twice keeps every value as an array. */
function readQuery(req: Request): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [k, v] of new URL(req.url).searchParams) {
    const prev = out[k];
    out[k] = prev === undefined ? v : Array.isArray(prev) ? [...prev, v] : [prev, v];
  }
  return out;
}

/** What a route says about itself: read by the role-matrix test, so a new route is covered at once. */
type BodyMeta = {
  body: "json" | "optional-json" | "none" | "raw";
  /** The body's parser, so a property-based test can generate only bodies the route must refuse. */
  parser?: Parser;
};
export type RouteMeta =
  | ({
      scope: "site";
      resource: ResourceKind;
      permission: PermissionName;
      /** A record-specific rule on top of the role (`authorize`): an allowed role may still be refused. */
      recordRule: boolean;
    } & BodyMeta)
  | ({ scope: "user"; permission?: PermissionName } & BodyMeta)
  | ({ scope: "public" } & BodyMeta);

export type SiteContext<R, I, Q> = {
  req: Request;
  params: Record<string, string>;
  user: SessionUser;
  site: Site;
  roles: SiteRole[];
  resource: R;
  input: I;
  query: Q;
  /** Whether the user's roles on this site allow another permission (for what a screen may offer). */
  may: (p: PermissionName) => boolean;
};

type BodyMode = "json" | "optional-json" | "raw";
const READ_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export function siteRoute<K extends ResourceKind, B extends Parser | undefined = undefined, Q extends Parser | undefined = undefined>(
  spec: {
    /** The record the route acts on, found by its path parameter (see lib/api/resources.ts). */
    resource: K;
    /** The role rule from lib/permissions.ts; checked after the record is found, before input is read. */
    permission: PermissionName;
    /** The sentence a refused role sees. */
    forbidden?: string;
    /** A record-specific rule on top of the role (e.g. a supervisor's issuing scope): throw ForbiddenError. */
    authorize?: (ctx: SiteContext<ResourceOf<K>, undefined, undefined>) => Promise<void> | void;
    body?: B;
    /** "optional-json": an empty body stands for {}; "raw": the handler reads `req` itself (CSV, multipart). */
    bodyMode?: BodyMode;
    query?: Q;
    /** An archived site is read-only: writes answer 409 unless the route says otherwise (restoring the site). */
    allowArchived?: boolean;
  },
  fn: (ctx: SiteContext<ResourceOf<K>, Parsed<B>, Parsed<Q>>) => Promise<Response | unknown>,
) {
  const bodyMode: RouteMeta["body"] = spec.bodyMode ?? (spec.body ? "json" : "none");
  const handler = apiHandler<Record<string, string>>(async (req, { params }) => {
    // Who is asking and, for a path with a site id, that site and their roles there: one round trip.
    const siteId = isUuid(params.siteId) ? params.siteId : undefined;
    const { user, access } = await requireApiSession(siteId);
    const loaded = await RESOURCES[spec.resource].load(user, params, siteId ? { siteId, access } : undefined);
    const may = (p: PermissionName) => rolesAllowPure(loaded.roles, p);
    if (!may(spec.permission)) throw new ForbiddenError(spec.forbidden);
    if (loaded.site.archivedAt && !spec.allowArchived && !READ_METHODS.has(req.method))
      throw new ConflictError("This site is archived and read-only. An organisation admin can restore it from the site's settings.");
    const base = { req, params, user, site: loaded.site, roles: loaded.roles, resource: loaded.resource as ResourceOf<K>, may };
    if (spec.authorize) await spec.authorize({ ...base, input: undefined, query: undefined });
    const query = (spec.query ? runParser(spec.query, readQuery(req)) : undefined) as Parsed<Q>;
    const input = (await readBody(req, spec.body, bodyMode)) as Parsed<B>;
    return fn({ ...base, input, query });
  });
  const meta: RouteMeta = { scope: "site", resource: spec.resource, permission: spec.permission, recordRule: Boolean(spec.authorize), body: bodyMode, parser: spec.body };
  return Object.assign(handler, { meta });
}

export type UserContext<I, Q> = { req: Request; params: Record<string, string>; user: SessionUser; input: I; query: Q };

/**
 * A route that needs a signed-in person but no site (the person's own account, their sites).
 * With `permission`, the person must hold a role allowing it on at least one of their sites (an
 * organisation admin counts as admin everywhere, even before the organisation has a site)
 * (e.g. `calculate` for the site-less calculator): someone with no role anywhere gets 403.
 */
export function userRoute<B extends Parser | undefined = undefined, Q extends Parser | undefined = undefined>(
  spec: { body?: B; bodyMode?: BodyMode; query?: Q; permission?: PermissionName; forbidden?: string },
  fn: (ctx: UserContext<Parsed<B>, Parsed<Q>>) => Promise<Response | unknown>,
) {
  const bodyMode: RouteMeta["body"] = spec.bodyMode ?? (spec.body ? "json" : "none");
  const handler = apiHandler<Record<string, string>>(async (req, { params }) => {
    const user = await requireApiUser();
    if (spec.permission) {
      const permission = spec.permission;
      // An organisation admin holds the admin role on every site of the organisation, including
      // the sites not made yet: a new organisation's first admin must be able to add its first site.
      const orgAdminAllowed = user.isOrgAdmin && rolesAllowPure(["admin"], permission);
      if (!orgAdminAllowed) {
        const sites = await listUserSites({ user });
        if (!sites.some((s) => rolesAllowPure(s.roles as SiteRole[], permission))) throw new ForbiddenError(spec.forbidden);
      }
    }
    const query = (spec.query ? runParser(spec.query, readQuery(req)) : undefined) as Parsed<Q>;
    const input = (await readBody(req, spec.body, bodyMode)) as Parsed<B>;
    return fn({ req, params, user, input, query });
  });
  const meta: RouteMeta = { scope: "user", permission: spec.permission, body: bodyMode, parser: spec.body };
  return Object.assign(handler, { meta });
}

export type PublicContext<I> = { req: Request; params: Record<string, string>; input: I };

/** A route anyone may call (health, ping, first-run setup, accepting an invitation, password resets). */
export function publicRoute<B extends Parser | undefined = undefined>(
  spec: { body?: B; bodyMode?: BodyMode },
  fn: (ctx: PublicContext<Parsed<B>>) => Promise<Response | unknown>,
) {
  const bodyMode: RouteMeta["body"] = spec.bodyMode ?? (spec.body ? "json" : "none");
  const handler = apiHandler<Record<string, string>>(async (req, { params }) => {
    const input = (await readBody(req, spec.body, bodyMode)) as Parsed<B>;
    return fn({ req, params, input });
  });
  const meta: RouteMeta = { scope: "public", body: bodyMode, parser: spec.body };
  return Object.assign(handler, { meta });
}
