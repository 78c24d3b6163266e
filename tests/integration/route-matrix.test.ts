// The role matrix, generated from the routes themselves: every app/api/**/route.ts is imported and
// each exported handler's `.meta` (lib/api/route.ts) says its scope, record and permission. So a
// new route is covered the moment it is declared, and a route that is not on the seam fails here.
//
// For each handler: signed out → 401; another organisation's admin → 404; each demo role the
// permission table (lib/permissions.ts) refuses → 403; each role it allows → neither 401, 403 nor
// 404 (and never a 500). Mutating requests carry a body that is not JSON, so an allowed role gets
// 422 and nothing in the database changes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { rolesAllowPure } from "@/lib/permissions";
import { putObject } from "@/lib/storage";
import type { SiteRole } from "@/db/schema";
import { anonymous, signInAs, type Client } from "../support/http";
import { declaredRoutes, routeFiles, type Method } from "../support/routes";


/** next-auth's own handler: not ours to wrap. */
const NOT_OURS = ["app/api/auth/[...nextauth]/route.ts"];

/** Routes not yet on the seam: none. A route listed here that is on the seam fails the test. */
const NOT_YET_ON_SEAM: string[] = [];

const files = routeFiles();
const routes = await declaredRoutes({ skip: NOT_OURS });

const DEMO = ["admin", "coordinator", "engineer", "supervisor", "designer", "manager"].map((r) => `${r}@demo.example`);
const OTHER_ADMIN = "admin@other.example";
const NOT_JSON = "{this is not json";
const SITE_NAME = "Orchard Row Basement";

type Fixture = Record<string, string>;
const fx: Fixture = {};
const clients = new Map<string, Client>();
/** Roles per demo user: on the fixture site, and on any of their sites (for site-less routes). */
const siteRoles = new Map<string, SiteRole[]>();
const anyRoles = new Map<string, SiteRole[]>();
const created: { alertId?: string; delegationId?: string; invitationId?: string; pdfKeyOf?: string } = {};

function fill(url: string): string {
  return url.replace(/\[([^\]]+)\]/g, (_, name: string) => {
    const v = fx[name];
    if (!v) throw new Error(`no fixture id for path parameter ${name} (add it to the fixture in beforeAll)`);
    return v;
  });
}

async function request(c: Client, method: Method, url: string) {
  const mutating = method !== "GET";
  const res = await c.fetch(fill(url), {
    method,
    ...(mutating ? { body: NOT_JSON, headers: { "content-type": "application/json" } } : {}),
  });
  const text = await res.text(); // read to the end (PDFs, CSV streams) so no connection is left open
  let json: unknown = null;
  try {
    json = JSON.parse(text);
  } catch {
    /* not JSON: a PDF or CSV */
  }
  return { status: res.status, json: json as { error?: { code: string } } | null };
}

/** Counts of everything a mutating request could change; equal before and after means nothing changed. */
async function fingerprint() {
  const [row] = await sql`
    select (select count(*) from audit_events)::int as audit, (select count(*) from alert_reads)::int as reads,
           (select count(*) from members)::int as members, (select count(*) from zones)::int as zones,
           (select count(*) from schemes)::int as schemes, (select count(*) from member_types)::int as types,
           (select count(*) from photos)::int as photos, (select count(*) from inspections)::int as inspections,
           (select count(*) from inspection_triggers)::int as triggers, (select count(*) from permits)::int as permits,
           (select count(*) from permit_delegations)::int as delegations, (select count(*) from alert_preferences)::int as prefs,
           (select max(updated_at) from members) as members_updated, (select max(updated_at) from member_types) as types_updated,
           (select max(updated_at) from schemes) as schemes_updated,
           (select count(*) from invitations)::int as invitations, (select max(coalesce(revoked_at, last_sent_at, created_at)) from invitations) as invitations_changed,
           (select count(*) from memberships)::int as memberships, (select count(*) from users where disabled_at is not null)::int as disabled,
           (select count(*) from password_resets)::int as resets, (select count(*) from organisations)::int as organisations,
           (select count(*) from sites)::int as sites, (select max(session_version) from users) as session_versions`;
  return row;
}

beforeAll(async () => {
  const [site] = await sql<{ id: string; organisation_id: string }[]>`select id, organisation_id from sites where name = ${SITE_NAME}`;
  fx.siteId = site!.id;
  const [member] = await sql<{ id: string; member_type_id: string; zone_id: string; scheme_id: string }[]>`
    select id, member_type_id, zone_id, scheme_id from members
    where site_id = ${site!.id} and zone_id is not null and scheme_id is not null order by tag limit 1`;
  fx.memberId = member!.id;
  fx.typeId = member!.member_type_id;
  fx.zoneId = member!.zone_id;
  fx.schemeId = member!.scheme_id;
  const [photo] = await sql<{ id: string }[]>`select id from photos where site_id = ${site!.id} order by created_at limit 1`;
  fx.photoId = photo!.id;
  const [permit] = await sql<{ id: string; pdf_key: string | null }[]>`select id, pdf_key from permits where site_id = ${site!.id} order by created_at limit 1`;
  fx.permitId = permit!.id;
  // The PDF route serves a stored PDF (404 until one is rendered): give the fixture permit one.
  if (!permit!.pdf_key) {
    const key = `test/route-matrix/${permit!.id}.pdf`;
    await putObject(key, "%PDF-1.4\n% route-matrix fixture\n", "application/pdf");
    await sql`update permits set pdf_key = ${key} where id = ${permit!.id}`;
    created.pdfKeyOf = permit!.id;
  }
  // The demo seed has no alert and no issuing scope; make one of each (removed afterwards). The
  // scope is already revoked, so it gives nobody the right to issue while this file runs.
  const [users] = await sql<{ coordinator: string; supervisor: string }[]>`
    select (select id from users where email = 'coordinator@demo.example') as coordinator,
           (select id from users where email = 'supervisor@demo.example') as supervisor`;
  const [alert] = await sql<{ id: string }[]>`
    insert into alerts (site_id, kind, subject_type, subject_id, threshold, title, body)
    values (${site!.id}, 'inspection_due', 'member', ${member!.id}, 'route-matrix', 'Route matrix fixture', 'Made by the role-matrix test.')
    returning id`;
  created.alertId = fx.alertId = alert!.id;
  const [delegation] = await sql<{ id: string }[]>`
    insert into permit_delegations (site_id, user_id, zone_ids, valid_until, granted_by, revoked_at)
    values (${site!.id}, ${users!.supervisor}, ${JSON.stringify([member!.zone_id])}::jsonb, now() + interval '1 day', ${users!.coordinator}, now())
    returning id`;
  created.delegationId = fx.delegationId = delegation!.id;
  // People and invitations: the engineer as the person acted on, a pending invitation of our own,
  // and a link token of the right shape (public token routes read their body before the token).
  const [engineer] = await sql<{ id: string }[]>`select id from users where email = 'engineer@demo.example'`;
  fx.userId = engineer!.id;
  const [invitation] = await sql<{ id: string }[]>`
    insert into invitations (organisation_id, email, site_id, roles, token_hash, invited_by, expires_at)
    values (${site!.organisation_id}, 'route-matrix-invitee@invited.example', ${site!.id}, '{engineer}', ${`route-matrix-${Date.now()}`}, ${users!.coordinator}, now() + interval '7 days')
    returning id`;
  created.invitationId = fx.invitationId = invitation!.id;
  fx.token = "A".repeat(43);

  clients.set("anonymous", anonymous());
  for (const email of [...DEMO, OTHER_ADMIN]) {
    const c = await signInAs(email);
    clients.set(email, c);
    const r = await c.json<{ items: { id: string; roles: SiteRole[] }[] }>("/api/v1/sites");
    expect(r.status).toBe(200);
    siteRoles.set(email, r.body.items.find((s) => s.id === site!.id)?.roles ?? []);
    anyRoles.set(email, [...new Set(r.body.items.flatMap((s) => s.roles))]);
  }
  // The matrix is only meaningful if the demo roles really differ on the fixture site.
  expect(siteRoles.get("manager@demo.example")).toEqual(["manager"]);
  expect(siteRoles.get("coordinator@demo.example")).toEqual(["coordinator"]);
}, 120_000);

afterAll(async () => {
  if (created.alertId) await sql`delete from alerts where id = ${created.alertId}`;
  if (created.delegationId) await sql`delete from permit_delegations where id = ${created.delegationId}`;
  if (created.invitationId) await sql`delete from invitations where id = ${created.invitationId}`;
  if (created.pdfKeyOf) await sql`update permits set pdf_key = null where id = ${created.pdfKeyOf}`;
  await sql.end({ timeout: 5 });
});

describe("every route handler is on the seam", () => {
  it("found the API's routes", () => {
    // The register, inspections, alerts and account routes at least (a broken discovery would pass everything).
    expect(routes.length).toBeGreaterThan(30);
    expect(routes.some((r) => r.url === "/api/v1/sites/[siteId]/members" && r.method === "POST")).toBe(true);
  });

  it("declares its scope, record and permission (.meta), except the listed routes other helpers are moving", () => {
    const missing = routes.filter((r) => !r.meta && !NOT_YET_ON_SEAM.includes(r.file)).map((r) => `${r.method} ${r.file}`);
    expect(missing, "route handlers not on the seam (lib/api/route.ts)").toEqual([]);
  });

  it("keeps NOT_YET_ON_SEAM honest: a listed route whose handlers are all on the seam must come off the list", () => {
    const done = NOT_YET_ON_SEAM.filter((f) => {
      const hs = routes.filter((r) => r.file === f);
      return hs.length > 0 && hs.every((r) => r.meta);
    });
    expect(done).toEqual([]);
    for (const f of NOT_YET_ON_SEAM) expect(files, `${f} no longer exists`).toContain(f);
  });
});

describe.each(routes.filter((r) => r.meta))("$method $url", ({ method, url, meta }) => {
  const m = meta!;
  const mutating = method !== "GET";

  if (m.scope !== "public") {
    it("answers 401 when nobody is signed in", async () => {
      const res = await request(clients.get("anonymous")!, method, url);
      expect(res.status).toBe(401);
    });
  } else {
    it("answers without a sign-in (and never a 500)", async () => {
      const res = await request(clients.get("anonymous")!, method, url);
      expect([401, 403, 404]).not.toContain(res.status);
      expect(res.status).toBeLessThan(500);
    });
  }

  if (m.scope === "site") {
    it("hides the record from another organisation's admin (404)", async () => {
      const res = await request(clients.get(OTHER_ADMIN)!, method, url);
      expect(res.status).toBe(404);
    });
  }

  if (m.scope === "site" || (m.scope === "user" && m.permission)) {
    const permission = m.permission!;
    it.each(DEMO)(`%s: 403 unless the role allows ${permission}; allowed roles pass to the use case${mutating ? " and get 422 for a body that is not JSON, nothing changed" : ""}`, async (email) => {
      const roles = (m.scope === "site" ? siteRoles : anyRoles).get(email)!;
      const allowed = rolesAllowPure(roles, permission);
      const before = mutating ? await fingerprint() : null;
      const res = await request(clients.get(email)!, method, url);
      if (!allowed) {
        expect(res.status, `${email} (${roles.join(", ")})`).toBe(403);
        expect(res.json?.error?.code).toBe("forbidden");
      } else if (mutating) {
        // A record-specific rule (e.g. a supervisor's issuing scope) is checked before the body is read.
        if (m.scope === "site" && m.recordRule) expect([403, 422], `${email} (${roles.join(", ")})`).toContain(res.status);
        else expect(res.status, `${email} (${roles.join(", ")})`).toBe(422);
      } else {
        // A record-specific rule (e.g. a supervisor's issuing scope) may still refuse an allowed role.
        const refused = m.scope === "site" && m.recordRule ? [401, 404] : [401, 403, 404];
        expect(refused, `${email} (${roles.join(", ")})`).not.toContain(res.status);
        expect(res.status).toBeLessThan(500);
      }
      if (before) expect(await fingerprint()).toEqual(before);
    });
  } else if (m.scope === "user") {
    it.each(DEMO)("%s: any signed-in person may call it", async (email) => {
      const before = mutating ? await fingerprint() : null;
      const res = await request(clients.get(email)!, method, url);
      if (mutating) expect(res.status).toBe(422);
      else expect(res.status).toBe(200);
      if (before) expect(await fingerprint()).toEqual(before);
    });
  }
});
