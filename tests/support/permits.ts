// Test data for the permit tests: members built the way the register stores them (the engine's
// check through runCheck), with photo and inspection rows inserted directly, each with unique tags.
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { checks, inspections, memberTypes, members, memberships, organisations, permits, photos, schemes, sites, users, zones } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { runCheck } from "@/lib/register/run-check";
import { DEMO_PASSWORD, signInAs, type Client } from "./http";

export const WHARF = "Wexcombe Wharf — Block B";
export const ORCHARD = "Orchard Row Basement";
export const L2 = "Level 2 slab, bays 1–4";
export const BP = "TW-WXW-014";

const clients = new Map<string, Client>();
export async function client(email: string): Promise<Client> {
  if (!clients.has(email)) clients.set(email, await signInAs(email));
  return clients.get(email)!;
}
export const coordinator = () => client("coordinator@demo.example");
export const engineer = () => client("engineer@demo.example");
export const supervisor = () => client("supervisor@demo.example");

let seq = 0;
export function unique(prefix: string) {
  seq += 1;
  return `${prefix}-${Date.now().toString(36).toUpperCase()}${seq}`;
}

export async function site(name = WHARF) {
  const [row] = await db.select().from(sites).where(eq(sites.name, name));
  return row!;
}

export async function zoneId(siteId: string, name = L2) {
  const [row] = await db.select({ id: zones.id }).from(zones).where(and(eq(zones.siteId, siteId), eq(zones.name, name)));
  return row!.id;
}

export async function schemeId(siteId: string, reference = BP) {
  const [row] = await db.select({ id: schemes.id }).from(schemes).where(and(eq(schemes.siteId, siteId), eq(schemes.reference, reference)));
  return row!.id;
}

/** A scheme of our own (unique reference); without a certificate unless one is given. */
export async function makeScheme(siteId: string, { category, certificateKey = null }: { category: number; certificateKey?: string | null }) {
  const [row] = await db
    .insert(schemes)
    .values({ siteId, reference: unique("TW-TEST"), title: "Test propping scheme", designerName: "Test Designer", category, certificateKey })
    .returning();
  return row!;
}

export type MakeMember = {
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

/** A member of the EN 1065 class B demo prop type, checked by the engine, with a photo and an in-date passed inspection by default. */
export async function makeMember(o: MakeMember = {}) {
  const s = await site(o.siteName ?? WHARF);
  const [type] = await db
    .select()
    .from(memberTypes)
    .where(and(eq(memberTypes.organisationId, s.organisationId), eq(memberTypes.name, "EN 1065 class B prop, 1.75–3.12 m")));
  const z = await zoneId(s.id, o.zone ?? L2);
  const sch = o.schemeIdOverride ?? (o.scheme === null ? null : await schemeId(s.id, o.scheme ?? BP));
  const [eng] = await db.select({ id: users.id }).from(users).where(eq(users.email, "engineer@demo.example"));
  const base = {
    siteId: s.id,
    tag: unique(o.prefix ?? "PT"),
    zoneId: z,
    schemeId: sch,
    memberTypeId: type!.id,
    extensionMm: o.extensionMm ?? 2500,
    endConditions: "pinned-pinned" as const,
    loadN: o.loadN ?? 6000,
    status: o.status ?? ("submitted" as const),
    createdBy: eng!.id,
  };
  const outcome = runCheck(type!, base, s);
  const [m] = await db
    .insert(members)
    .values({ ...base, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass })
    .returning();
  const [c] = await db
    .insert(checks)
    .values({ memberId: m!.id, method: outcome.method, reason: "logged", inputs: outcome.inputs, result: outcome.result, capacityN: outcome.capacityN, utilisation: outcome.utilisation, pass: outcome.pass, engineVersion: outcome.engineVersion })
    .returning({ id: checks.id });
  await db.update(members).set({ latestCheckId: c!.id }).where(eq(members.id, m!.id));
  if (o.photo !== false)
    await db.insert(photos).values({ siteId: s.id, memberId: m!.id, objectKey: `test/${m!.id}.jpg`, status: o.photo ?? "ready", contentType: "image/jpeg" });
  const insp = o.inspection ?? "pass";
  if (insp) {
    const DAY = 86_400_000;
    const at = new Date(Date.now() - (insp === "overdue" ? 9 : 1) * DAY);
    await db.insert(inspections).values({
      siteId: s.id,
      memberId: m!.id,
      result: insp === "fail" ? "fail" : "pass",
      inspectedAt: at,
      nextDueAt: insp === "fail" ? null : new Date(at.getTime() + 7 * DAY),
    });
  }
  return { ...m!, latestCheckId: c!.id, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass };
}

/** Changes a member's load and stores the engine's new check, as an edit in the register would. */
export async function recheckWithLoad(memberId: string, loadN: number) {
  const [m] = await db.select().from(members).where(eq(members.id, memberId));
  const [type] = await db.select().from(memberTypes).where(eq(memberTypes.id, m!.memberTypeId));
  const [s] = await db.select().from(sites).where(eq(sites.id, m!.siteId));
  const outcome = runCheck(type!, { ...m!, loadN }, s!);
  const [c] = await db
    .insert(checks)
    .values({ memberId, method: outcome.method, reason: "edited", inputs: outcome.inputs, result: outcome.result, capacityN: outcome.capacityN, utilisation: outcome.utilisation, pass: outcome.pass, engineVersion: outcome.engineVersion })
    .returning({ id: checks.id });
  await db.update(members).set({ loadN, latestCheckId: c!.id, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass }).where(eq(members.id, memberId));
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

/** A person holding `role` on the named site only (demo organisation), signed in. */
export async function personWithRole(role: "coordinator" | "supervisor" | "engineer", siteName: string) {
  const [org] = await db.select().from(organisations).where(eq(organisations.slug, "larkfield"));
  const s = await site(siteName);
  const email = `${unique(role)}@demo.example`.toLowerCase();
  const [u] = await db.insert(users).values({ organisationId: org!.id, email, name: `Test ${role} ${email.slice(0, 12)}`, passwordHash: await hashPassword(DEMO_PASSWORD) }).returning();
  await db.insert(memberships).values({ userId: u!.id, siteId: s.id, role });
  return { user: u!, client: await signInAs(email) };
}

export async function post<T = unknown>(c: Client, path: string, body?: unknown) {
  return c.json<T>(path, { method: "POST", ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
}

export type ApiErr = { error: { code: string; message: string; fields?: Record<string, string> } };

/** Requests a permit to load for the given members through the API, as the engineer. */
export async function requestLoad(memberIds: string[], siteIdValue: string, who?: Client) {
  const c = who ?? (await engineer());
  const r = await post<{ permit: { id: string } } & ApiErr>(c, `/api/v1/sites/${siteIdValue}/permits`, { kind: "load", scope: "members", memberIds });
  if (r.status !== 201) throw new Error(`request failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.permit.id;
}
