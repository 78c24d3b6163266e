// The one test kit for the integration tests. Sections, in order:
//   clients   — signed-in clients per demo role, cached per address (`as(role)`, `client(email)`), `post`
//   tags      — unique tags and e-mail addresses
//   demo      — the demo sites, zones, schemes and member types by name
//   people    — people holding roles, made directly in the database
//   members   — members stored the way the register stores them (row + the engine's check)
//   register  — a throwaway site in the demo organisation for list/import tests
//   alerts    — a fresh organisation of its own (people, zones, a scheme, types) for alert tests
//   onboarding, photos, PDFs — e-mail links from the outbox, invitations, JPEG uploads, PDF text
// Every helper with more than one input takes one object.
import { randomUUID } from "node:crypto";
import { and, eq, inArray, sql as dsql } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import sharp from "sharp";
import { db, sql } from "@/db";
import {
  checks, inspections, members, memberships, memberTypes, organisations, outbox, permitMembers, permits, photos, schemes, sites, users, zones,
  type SiteRole,
} from "@/db/schema";
import { DEMO_USERS } from "@/db/seed/data";
import { hashPassword } from "@/lib/auth/password";
import { runCheck } from "@/lib/register/run-check";
import { BP, L2, ORCHARD, WHARF } from "./demo";
import { anonymous, DEMO_PASSWORD, signInAs, type Client } from "./http";

// ── clients ───────────────────────────────────────────────────────────────────────────────────

export const ROLES = ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"] as const satisfies readonly SiteRole[];
export type Role = (typeof ROLES)[number];

const clients = new Map<string, Client>();
/** A signed-in client for an address, signed in once per test file. */
export async function client(email: string): Promise<Client> {
  if (!clients.has(email)) clients.set(email, await signInAs(email));
  return clients.get(email)!;
}
/** The demo person holding `who` (or the other organisation's admin), signed in once per test file. */
export function as(who: Role | "other"): Promise<Client> {
  return client(who === "other" ? "admin@other.example" : `${who}@demo.example`);
}

export async function post<T = unknown>(c: Client, path: string, body?: unknown) {
  return c.json<T>(path, { method: "POST", ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
}

export type ApiErr = { error: { code: string; message: string; fields?: Record<string, string> } };

// ── tags ──────────────────────────────────────────────────────────────────────────────────────

let seq = 0;
/** A tag (or reference) no other test uses: `PREFIX-<time>-<n>`. */
export function uniqueTag(prefix = "IT") {
  seq += 1;
  return `${prefix}-${Date.now().toString(36).toUpperCase()}-${seq}`;
}

/** An address no other test uses. */
export function freshEmail(what = "person") {
  seq += 1;
  return `${what}-${Date.now().toString(36)}-${seq}@onboarding.example`;
}

// ── demo ──────────────────────────────────────────────────────────────────────────────────────

export { BP, L2, ORCHARD, WHARF };

/** A demo site's row, by name. */
export async function site(name = WHARF) {
  const [row] = await db.select().from(sites).where(eq(sites.name, name));
  if (!row) throw new Error(`demo site ${name} not found`);
  return row;
}

export async function siteId(name = WHARF): Promise<string> {
  return (await site(name)).id;
}

export async function zoneId({ siteId, name = L2 }: { siteId: string; name?: string }) {
  const [row] = await db.select({ id: zones.id }).from(zones).where(and(eq(zones.siteId, siteId), eq(zones.name, name)));
  return row!.id;
}

export async function schemeId({ siteId, reference = BP }: { siteId: string; reference?: string }) {
  const [row] = await db.select({ id: schemes.id }).from(schemes).where(and(eq(schemes.siteId, siteId), eq(schemes.reference, reference)));
  return row!.id;
}

/** A site's zones, schemes and member types as the API lists them, with finders by name. */
export async function lookups(site: string) {
  const c = await as("manager");
  const [zones, schemes, types] = await Promise.all([
    c.json<{ items: { id: string; name: string }[] }>(`/api/v1/sites/${site}/zones`),
    c.json<{ items: { id: string; reference: string; slabThicknessMm: number | null }[] }>(`/api/v1/sites/${site}/schemes`),
    c.json<{ items: { id: string; name: string; kind: string }[] }>(`/api/v1/sites/${site}/member-types`),
  ]);
  const type = (prefix: string) => types.body.items.find((t) => t.name.startsWith(prefix))!.id;
  return {
    zone: (name: string) => zones.body.items.find((z) => z.name === name)!.id,
    scheme: (ref: string) => schemes.body.items.find((s) => s.reference === ref)!.id,
    type,
    propD: type("EN 1065 class D"),
    zones: zones.body.items,
    types: types.body.items,
  };
}

/** A scheme of our own (unique reference); without a certificate unless one is given. */
export async function makeScheme({ siteId, category, certificateKey = null }: { siteId: string; category: number; certificateKey?: string | null }) {
  const [row] = await db
    .insert(schemes)
    .values({ siteId, reference: uniqueTag("TW-TEST"), title: "Test propping scheme", designerName: "Test Designer", category, certificateKey })
    .returning();
  return row!;
}

// ── people ────────────────────────────────────────────────────────────────────────────────────

let demoHash: Promise<string> | null = null;
/** A user of the organisation holding `role` on the site, who signs in with the demo password. */
async function addPerson(o: { organisationId: string; siteId: string; role: SiteRole; email: string; name: string; isOrgAdmin?: boolean }) {
  demoHash ??= hashPassword(DEMO_PASSWORD);
  const [u] = await db
    .insert(users)
    .values({ organisationId: o.organisationId, email: o.email, name: o.name, passwordHash: await demoHash, isOrgAdmin: o.isOrgAdmin ?? false })
    .returning();
  await db.insert(memberships).values({ userId: u!.id, siteId: o.siteId, role: o.role });
  return u!;
}

/** A person holding `role` on the named demo site only (demo organisation), signed in. */
export async function personWithRole({ role, siteName }: { role: "coordinator" | "supervisor" | "engineer"; siteName: string }) {
  const [org] = await db.select().from(organisations).where(eq(organisations.slug, "larkfield"));
  const s = await site(siteName);
  const email = `${uniqueTag(role)}@demo.example`.toLowerCase();
  const user = await addPerson({ organisationId: org!.id, siteId: s.id, role, email, name: `Test ${role} ${email.slice(0, 12)}` });
  return { user, client: await signInAs(email) };
}

// ── members ───────────────────────────────────────────────────────────────────────────────────

type MemberType = typeof memberTypes.$inferSelect;
type SiteRow = typeof sites.$inferSelect;
type MemberValues = typeof members.$inferInsert & Parameters<typeof runCheck>[1];

/** Stores a member with the engine's check as its latest check, as the register logs one. */
async function insertCheckedMember({ type, values, site }: { type: MemberType; values: MemberValues; site: SiteRow }) {
  const outcome = runCheck(type, values, site);
  const [m] = await db.insert(members).values({ ...values, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass }).returning();
  const checkId = await insertCheck({ memberId: m!.id, outcome, reason: "logged" });
  await db.update(members).set({ latestCheckId: checkId }).where(eq(members.id, m!.id));
  return { member: { ...m!, latestCheckId: checkId }, outcome };
}

async function insertCheck({ memberId, outcome, reason }: { memberId: string; outcome: ReturnType<typeof runCheck>; reason: "logged" | "edited" }) {
  const [c] = await db
    .insert(checks)
    .values({ memberId, method: outcome.method, reason, inputs: outcome.inputs, result: outcome.result, capacityN: outcome.capacityN, utilisation: outcome.utilisation, pass: outcome.pass, engineVersion: outcome.engineVersion })
    .returning({ id: checks.id });
  return c!.id;
}

type MakeMember = {
  siteName?: string;
  zone?: string;
  scheme?: string | null;
  schemeIdOverride?: string;
  prefix?: string;
  /** Working load, N. The class B prop at 2.5 m carries a few kN comfortably and fails well above 20 kN. */
  loadN?: number;
  extensionMm?: number;
  status?: "draft" | "submitted" | "loaded";
  photo?: "ready" | "pending" | false;
  inspection?: "pass" | "overdue" | "fail" | false;
};

/** A member of the EN 1065 class B demo prop type on a demo site, checked by the engine, with a photo and an in-date passed inspection by default. */
export async function makeMember(o: MakeMember = {}) {
  const s = await site(o.siteName ?? WHARF);
  const [type] = await db
    .select()
    .from(memberTypes)
    .where(and(eq(memberTypes.organisationId, s.organisationId), eq(memberTypes.name, "EN 1065 class B prop, 1.75–3.12 m")));
  const z = await zoneId({ siteId: s.id, name: o.zone ?? L2 });
  const sch = o.schemeIdOverride ?? (o.scheme === null ? null : await schemeId({ siteId: s.id, reference: o.scheme ?? BP }));
  const [eng] = await db.select({ id: users.id }).from(users).where(eq(users.email, "engineer@demo.example"));
  const values = {
    siteId: s.id,
    tag: uniqueTag(o.prefix ?? "PT"),
    zoneId: z,
    schemeId: sch,
    memberTypeId: type!.id,
    extensionMm: o.extensionMm ?? 2500,
    endConditions: "pinned-pinned" as const,
    loadN: o.loadN ?? 6000,
    status: o.status ?? ("submitted" as const),
    createdBy: eng!.id,
  };
  const { member: m } = await insertCheckedMember({ type: type!, values, site: s });
  if (o.photo !== false)
    await db.insert(photos).values({ siteId: s.id, memberId: m.id, objectKey: `test/${m.id}.jpg`, status: o.photo ?? "ready", contentType: "image/jpeg" });
  const insp = o.inspection ?? "pass";
  if (insp) {
    const DAY = 86_400_000;
    const at = new Date(Date.now() - (insp === "overdue" ? 9 : 1) * DAY);
    await db.insert(inspections).values({
      siteId: s.id,
      memberId: m.id,
      result: insp === "fail" ? "fail" : "pass",
      inspectedAt: at,
      nextDueAt: insp === "fail" ? null : new Date(at.getTime() + 7 * DAY),
    });
  }
  return m;
}

/** Changes a member's load and stores the engine's new check, as an edit in the register would. */
export async function recheckWithLoad({ memberId, loadN }: { memberId: string; loadN: number }) {
  const [m] = await db.select().from(members).where(eq(members.id, memberId));
  const [type] = await db.select().from(memberTypes).where(eq(memberTypes.id, m!.memberTypeId));
  const [s] = await db.select().from(sites).where(eq(sites.id, m!.siteId));
  const outcome = runCheck(type!, { ...m!, loadN }, s!);
  const checkId = await insertCheck({ memberId, outcome, reason: "edited" });
  await db.update(members).set({ loadN, latestCheckId: checkId, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass }).where(eq(members.id, memberId));
  return outcome;
}

export async function memberStates(ids: string[]) {
  const rows = await db.select({ id: members.id, status: members.status }).from(members).where(inArray(members.id, ids));
  return Object.fromEntries(rows.map((r) => [r.id, r.status]));
}

export async function permitRow(id: string) {
  const [row] = await db.select().from(permits).where(eq(permits.id, id));
  return row!;
}

/** Requests a permit to load for the given members through the API, as the engineer unless `by` is given. */
export async function requestLoad({ memberIds, siteId, by }: { memberIds: string[]; siteId: string; by?: Client }) {
  const c = by ?? (await as("engineer"));
  const r = await post<{ permit: { id: string } } & ApiErr>(c, `/api/v1/sites/${siteId}/permits`, { kind: "load", scope: "members", memberIds });
  if (r.status !== 201) throw new Error(`request failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.permit.id;
}

// ── register ──────────────────────────────────────────────────────────────────────────────────
// A throwaway site in the demo organisation for register list/import tests, so they can count
// and page through members without other tests' members on the demo sites changing the answer.
// Every demo user holds their role on it; drop() removes it and everything on it.

export type FixtureMember = {
  id: string;
  tag: string;
  status: "draft" | "submitted" | "loaded" | "struck" | "out_of_service";
  zoneId: string | null;
  schemeId: string | null;
  typeId: string;
  extensionMm: number;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  updatedAt: Date;
};

export type RegisterSite = {
  id: string;
  name: string;
  zones: { id: string; name: string }[];
  schemes: { id: string; reference: string }[];
  types: { id: string; name: string }[];
  members: FixtureMember[];
  drop: () => Promise<void>;
};

const STATUSES = ["draft", "submitted", "loaded", "struck", "out_of_service"] as const;

/** Deterministic spread of values (no engine: the list is under test here, not the checks). */
export async function makeRegisterSite({ members: count = 0, label = "List" }: { members?: number; label?: string } = {}): Promise<RegisterSite> {
  const suffix = randomUUID().slice(0, 8);
  const [org] = await sql<{ id: string }[]>`select id from organisations where slug = 'larkfield'`;
  const name = `${label} test site ${suffix}`;
  const [row] = await sql<{ id: string }[]>`
    insert into sites (organisation_id, name, code) values (${org!.id}, ${name}, ${`T-${suffix}`}) returning id`;
  const id = row!.id;
  try {
    return await fill();
  } catch (e) {
    // Never leave a half-made site behind for other tests to trip over.
    await sql`delete from sites where id = ${id}`;
    throw e;
  }

  async function fill(): Promise<RegisterSite> {
    for (const u of DEMO_USERS) {
      await sql`insert into memberships (user_id, site_id, role)
        select id, ${id}, ${u.role} from users where email = ${u.email}`;
    }
    const zones = await sql<{ id: string; name: string }[]>`
      insert into zones (site_id, name, level) values (${id}, 'Deck A', 'L1'), (${id}, 'Deck B, east', 'L2')
      returning id, name`;
    const schemes = await sql<{ id: string; reference: string }[]>`
      insert into schemes (site_id, reference, title, designer_name, category, design_load_n, design_spacing_x_mm, design_spacing_y_mm, slab_thickness_mm)
      values (${id}, ${`TW-T-${suffix}-1`}, 'Deck A propping', 'Test designer', 2, 24000, 1200, 1200, 250),
             (${id}, ${`TW-T-${suffix}-2`}, 'Deck B propping', 'Test designer', 1, 20000, 1200, 1200, 200)
      returning id, reference`;
    const types = await sql<{ id: string; name: string }[]>`
      select id, name from member_types where organisation_id = ${org!.id} and archived_at is null order by name`;

    const now = Date.now();
    const rows: FixtureMember[] = [];
    for (let i = 0; i < count; i++) {
      // Some tags carry characters that mean something to LIKE, to prove search takes text literally.
      const tag = i % 97 === 5 ? `RT_${String(i).padStart(4, "0")}` : i % 89 === 7 ? `rt-lower-${String(i).padStart(4, "0")}` : `RT-${String(i).padStart(4, "0")}`;
      const unchecked = i % 41 === 3;
      const capacityN = unchecked ? null : 20000 + ((i * 37) % 50) * 1000;
      const loadN = 4000 + ((i * 53) % 60) * 500;
      // Repeated utilisations (i % 10 === 0 share one value) so ties must be broken by tag.
      const utilisation = capacityN === null ? null : i % 10 === 0 ? 0.5 : loadN / capacityN;
      rows.push({
        id: randomUUID(),
        tag,
        status: STATUSES[i % STATUSES.length]!,
        zoneId: i % 7 === 0 ? null : zones[i % 2]!.id,
        schemeId: i % 5 === 0 ? null : schemes[i % 2]!.id,
        typeId: types[i % types.length]!.id,
        extensionMm: 1800 + ((i * 29) % 40) * 25,
        loadN,
        capacityN,
        utilisation,
        pass: utilisation === null ? false : utilisation <= 1,
        updatedAt: new Date(now - ((i * 7919) % 100000) * 1000),
      });
    }
    for (let i = 0; i < rows.length; i += 500) {
      const batch = rows.slice(i, i + 500).map((m) => ({
        id: m.id,
        site_id: id,
        tag: m.tag,
        status: m.status,
        zone_id: m.zoneId,
        scheme_id: m.schemeId,
        member_type_id: m.typeId,
        extension_mm: m.extensionMm,
        load_n: m.loadN,
        capacity_n: m.capacityN,
        utilisation: m.utilisation,
        check_pass: m.pass,
        updated_at: m.updatedAt.toISOString(),
      }));
      await sql`insert into members ${sql(batch)}`;
    }
    return {
      id,
      name,
      zones,
      schemes,
      types,
      members: rows,
      drop: async () => {
        await sql`delete from sites where id = ${id}`;
      },
    };
  }
}

// ── alerts ────────────────────────────────────────────────────────────────────────────────────
// A fresh organisation with one site, its own people (one per role) and members, so the alert and
// inspection tests can move the clock and fail members without touching the demo data that other
// tests rely on.

/** An invented supplier table (read on a 1/L² basis between rows; the 2.0 m row is what members at the default extension read). */
export const TABLE_STRONG = [
  { lengthMm: 1500, safeLoadN: 40_000 },
  { lengthMm: 2000, safeLoadN: 35_000 },
  { lengthMm: 2500, safeLoadN: 30_000 },
  { lengthMm: 3500, safeLoadN: 20_000 },
];
const TABLE_WEAK = [
  { lengthMm: 1500, safeLoadN: 20_000 },
  { lengthMm: 3500, safeLoadN: 10_000 },
];

export type AlertsOrg = Awaited<ReturnType<typeof makeAlertsOrg>>;

const made: { orgId: string; siteId: string; userIds: string[] }[] = [];

/** Removes every alerts organisation this test file made (other tests count organisations and users). */
export async function removeAlertsOrgs() {
  for (const f of made.splice(0)) {
    await db.delete(outbox).where(inArray(outbox.toUserId, f.userIds));
    await db.delete(outbox).where(eq(outbox.siteId, f.siteId));
    await db.delete(photos).where(eq(photos.siteId, f.siteId));
    await db.delete(sites).where(eq(sites.id, f.siteId));
    await db.delete(memberTypes).where(eq(memberTypes.organisationId, f.orgId));
    await db.delete(users).where(inArray(users.id, f.userIds));
    await db.delete(organisations).where(eq(organisations.id, f.orgId));
  }
}

export async function makeAlertsOrg({ label }: { label: string }) {
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  const [org] = await db.insert(organisations).values({ name: `Fixture ${tag}`, slug: `fixture-${tag}` }).returning();
  const [site] = await db
    .insert(sites)
    .values({ organisationId: org!.id, name: `Fixture site ${tag}`, code: tag.toUpperCase(), inspectionIntervalDays: 7, expiryWarningHours: 24 })
    .returning();
  const people = {} as Record<Role, { id: string; email: string; name: string }>;
  for (const role of ROLES) {
    const email = `${role}.${tag}@fixture.example`;
    const u = await addPerson({ organisationId: org!.id, siteId: site!.id, role, email, name: `${role[0]!.toUpperCase()}${role.slice(1)} ${tag}`, isOrgAdmin: role === "admin" });
    people[role] = { id: u.id, email, name: u.name };
  }
  made.push({ orgId: org!.id, siteId: site!.id, userIds: Object.values(people).map((p) => p.id) });
  const [zoneA] = await db.insert(zones).values({ siteId: site!.id, name: "Zone A" }).returning();
  const [zoneB] = await db.insert(zones).values({ siteId: site!.id, name: "Zone B" }).returning();
  const [scheme] = await db
    .insert(schemes)
    .values({
      siteId: site!.id, reference: `TW-${tag}`, title: "Fixture back-propping", designerName: people.designer.name, category: 1,
      slabThicknessMm: 250, concreteDensityKnM3: 25, formworkKnM2: 0.5, constructionKnM2: 1.5,
    })
    .returning();
  const [strong] = await db
    .insert(memberTypes)
    .values({ organisationId: org!.id, name: `Strong shore ${tag}`, kind: "supplier-table", params: { table: TABLE_STRONG }, minExtensionMm: 1500, maxExtensionMm: 3500 })
    .returning();
  const [weak] = await db
    .insert(memberTypes)
    .values({ organisationId: org!.id, name: `Light shore ${tag}`, kind: "supplier-table", params: { table: TABLE_WEAK }, minExtensionMm: 1500, maxExtensionMm: 3500 })
    .returning();

  async function addMember(o: {
    tag: string; zone?: "A" | "B"; status?: (typeof members.status.enumValues)[number]; extensionMm?: number; loadN?: number;
    slab?: { spacingMm: number }; type?: "strong" | "weak";
  }) {
    const type = o.type === "weak" ? weak! : strong!;
    const spacing = o.slab?.spacingMm ?? null;
    // A slab-derived load: area × (0.25 m × 25 kN/m³ + 0.5 + 1.5 kN/m²) = area × 8.25 kN/m².
    const loadN = spacing != null ? (spacing / 1000) ** 2 * 8.25 * 1000 : (o.loadN ?? 25_000);
    const values = {
      siteId: site!.id, tag: o.tag, zoneId: (o.zone === "B" ? zoneB : zoneA)!.id, schemeId: scheme!.id, memberTypeId: type.id,
      extensionMm: o.extensionMm ?? 2000, endConditions: "pinned-pinned" as const, loadSource: spacing != null ? ("slab" as const) : ("direct" as const),
      spacingXMm: spacing, spacingYMm: spacing, loadN, status: o.status ?? "submitted", createdBy: people.engineer.id,
    };
    const { member, outcome } = await insertCheckedMember({ type, values, site: site! });
    return { id: member.id, tag: o.tag, pass: outcome.pass };
  }

  async function addInspection({ memberId, at, result = "pass" }: { memberId: string; at: Date; result?: "pass" | "fail" }) {
    await db.insert(inspections).values({
      siteId: site!.id, memberId, inspectorId: people.engineer.id, result, items: [], inspectedAt: at,
      nextDueAt: result === "pass" ? new Date(at.getTime() + 7 * 86_400_000) : null,
    });
  }

  async function addPermit(o: { memberIds: string[]; validUntil: Date; number: number; recipients?: string[] }) {
    // The request number as the app gives it: the site's counter, bumped.
    const [counter] = await db.update(sites).set({ requestCounter: dsql`${sites.requestCounter} + 1` }).where(eq(sites.id, site!.id)).returning({ n: sites.requestCounter });
    const [p] = await db
      .insert(permits)
      .values({
        siteId: site!.id, kind: "load", number: o.number, requestNumber: counter!.n, status: "issued", schemeId: scheme!.id, requestedBy: people.engineer.id,
        approvedBy: people.coordinator.id, issuedAt: new Date(o.validUntil.getTime() - 7 * 86_400_000), validUntil: o.validUntil,
        recipients: o.recipients ?? [people.supervisor.email, people.engineer.email],
      })
      .returning();
    await db.insert(permitMembers).values(o.memberIds.map((memberId) => ({ permitId: p!.id, memberId })));
    return p!;
  }

  return { tag, org: org!, site: site!, people, zoneA: zoneA!, zoneB: zoneB!, scheme: scheme!, types: { strong: strong!, weak: weak! }, addMember, addInspection, addPermit };
}

// ── onboarding ────────────────────────────────────────────────────────────────────────────────

export const GOOD_PASSWORD = "violet harbour crane 47";

/** The newest e-mail of a kind queued for an address, and the token in its link. */
export async function latestLink({ email, kind }: { email: string; kind: "invitation" | "password_reset" }) {
  const rows = await sql<{ text: string; subject: string }[]>`
    select text, subject from outbox where lower(to_email) = ${email.toLowerCase()} and kind = ${kind} order by created_at desc limit 1`;
  const text = rows[0]?.text ?? "";
  const m = text.match(/\/(?:invite|reset-password)\/([A-Za-z0-9_-]{43})/);
  return { token: m?.[1] ?? null, text, subject: rows[0]?.subject ?? null };
}

export async function countOutbox({ email, kind }: { email: string; kind: string }) {
  const [row] = await sql<{ n: number }[]>`select count(*)::int as n from outbox where lower(to_email) = ${email.toLowerCase()} and kind = ${kind}`;
  return row!.n;
}

/** Admin invites a new address to the site; the invitee accepts with a good password and signs in. */
export async function invitePerson({ admin, siteId, roles, what = "person" }: { admin: Client; siteId: string; roles: string[]; what?: string }) {
  const email = freshEmail(what);
  const inv = await admin.json<{ invitation: { id: string } }>(`/api/v1/sites/${siteId}/invitations`, { method: "POST", body: { email, name: `Test ${what}`, roles } });
  if (inv.status !== 201) throw new Error(`invite failed: ${inv.status} ${JSON.stringify(inv.body)}`);
  const { token } = await latestLink({ email, kind: "invitation" });
  const accepted = await anonymous().json<{ user: { id: string } }>(`/api/v1/invitations/${token}/accept`, { method: "POST", body: { name: `Test ${what}`, password: GOOD_PASSWORD } });
  if (accepted.status !== 201) throw new Error(`accept failed: ${accepted.status} ${JSON.stringify(accepted.body)}`);
  const client = await signInAs(email, GOOD_PASSWORD);
  return { email, userId: accepted.body.user.id, invitationId: inv.body.invitation.id, client };
}

// ── photos and PDFs ───────────────────────────────────────────────────────────────────────────

/** A small generated JPEG, optionally with EXIF that includes a taken-at time and GPS position. */
export async function jpeg({ exif = false, size = 64 }: { exif?: boolean; size?: number } = {}): Promise<Buffer> {
  let img = sharp({ create: { width: size, height: size, channels: 3, background: "#3366aa" } }).jpeg();
  if (exif) {
    img = img.withExif({
      IFD0: { Make: "TestCam" },
      IFD2: { DateTimeOriginal: "2024:05:06 07:08:09" },
      IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" },
    });
  }
  return img.toBuffer();
}

/** Presign → PUT → complete, as the phone does. */
export async function uploadPhoto({ by, presignPath, bytes, contentType = "image/jpeg", declaredSize = bytes.length }: {
  by: Client; presignPath: string; bytes: Buffer; contentType?: string; declaredSize?: number;
}) {
  const start = await by.json<{ photoId: string; uploadUrl: string }>(presignPath, { method: "POST", body: { contentType, size: declaredSize } });
  if (start.status !== 201) return { start, put: null, complete: null };
  const put = await fetch(start.body.uploadUrl, { method: "PUT", headers: { "content-type": contentType }, body: new Uint8Array(bytes) });
  const complete = await by.json<{ photo: { id: string; thumbnailUrl: string; displayUrl: string; takenAt: string | null; status: string }; error?: { message: string; fields?: Record<string, string> } }>(
    `/api/v1/photos/${start.body.photoId}/complete`,
    { method: "POST" },
  );
  return { start, put, complete };
}

/** pdf-parse (pdf.js underneath) turns the PDF into its text, as a reader of the printout would see it. */
export async function pdfText(bytes: ArrayBuffer) {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}
