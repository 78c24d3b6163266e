// A fresh organisation with one site, its own people (one per role) and members, so the alert and
// inspection tests can move the clock and fail members without touching the demo data that other
// tests rely on. Members are stored the way the register stores them: the row plus a check
// snapshot from the real engine.
import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import {
  checks, inspections, members, memberships, memberTypes, organisations, outbox, permitMembers, permits, photos, schemes, sites, users, zones,
  type SiteRole,
} from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { runCheck } from "@/lib/register/run-check";
import { DEMO_PASSWORD } from "./http";

let hash: Promise<string> | null = null;
const ROLES: SiteRole[] = ["manager", "coordinator", "engineer", "supervisor", "designer", "admin"];

/** An invented supplier table (read on a 1/L² basis between rows; the 2.0 m row is what members at the default extension read). */
export const TABLE_STRONG = [
  { lengthMm: 1500, safeLoadN: 40_000 },
  { lengthMm: 2000, safeLoadN: 35_000 },
  { lengthMm: 2500, safeLoadN: 30_000 },
  { lengthMm: 3500, safeLoadN: 20_000 },
];
export const TABLE_WEAK = [
  { lengthMm: 1500, safeLoadN: 20_000 },
  { lengthMm: 3500, safeLoadN: 10_000 },
];

export type Fixture = Awaited<ReturnType<typeof makeFixture>>;

const made: { orgId: string; siteId: string; userIds: string[] }[] = [];

/** Removes every fixture this test file made (other tests count organisations and users). */
export async function removeFixtures() {
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

export async function makeFixture(label: string) {
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  hash ??= hashPassword(DEMO_PASSWORD);
  const passwordHash = await hash;
  const [org] = await db.insert(organisations).values({ name: `Fixture ${tag}`, slug: `fixture-${tag}` }).returning();
  const [site] = await db
    .insert(sites)
    .values({ organisationId: org!.id, name: `Fixture site ${tag}`, code: tag.toUpperCase(), inspectionIntervalDays: 7, expiryWarningHours: 24 })
    .returning();
  const people = {} as Record<SiteRole, { id: string; email: string; name: string }>;
  for (const role of ROLES) {
    const email = `${role}.${tag}@fixture.example`;
    const [u] = await db
      .insert(users)
      .values({ organisationId: org!.id, email, name: `${role[0]!.toUpperCase()}${role.slice(1)} ${tag}`, passwordHash, isOrgAdmin: role === "admin" })
      .returning();
    await db.insert(memberships).values({ userId: u!.id, siteId: site!.id, role });
    people[role] = { id: u!.id, email, name: u!.name };
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
    const base = {
      siteId: site!.id, tag: o.tag, zoneId: (o.zone === "B" ? zoneB : zoneA)!.id, schemeId: scheme!.id, memberTypeId: type.id,
      extensionMm: o.extensionMm ?? 2000, endConditions: "pinned-pinned" as const, loadSource: spacing != null ? ("slab" as const) : ("direct" as const),
      spacingXMm: spacing, spacingYMm: spacing, loadN, status: o.status ?? "submitted", createdBy: people.engineer.id,
    };
    const outcome = runCheck(type, base, site!);
    const [m] = await db.insert(members).values({ ...base, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass }).returning();
    const [c] = await db
      .insert(checks)
      .values({ memberId: m!.id, method: outcome.method, reason: "logged", inputs: outcome.inputs, result: outcome.result, capacityN: outcome.capacityN, utilisation: outcome.utilisation, pass: outcome.pass, engineVersion: outcome.engineVersion })
      .returning();
    await db.update(members).set({ latestCheckId: c!.id }).where(eq(members.id, m!.id));
    return { id: m!.id, tag: o.tag, pass: outcome.pass };
  }

  async function addInspection(memberId: string, o: { at: Date; result?: "pass" | "fail" }) {
    const result = o.result ?? "pass";
    await db.insert(inspections).values({
      siteId: site!.id, memberId, inspectorId: people.engineer.id, result, items: [], inspectedAt: o.at,
      nextDueAt: result === "pass" ? new Date(o.at.getTime() + 7 * 86_400_000) : null,
    });
  }

  async function addPermit(o: { memberIds: string[]; validUntil: Date; number: number; recipients?: string[] }) {
    const [p] = await db
      .insert(permits)
      .values({
        siteId: site!.id, kind: "load", number: o.number, status: "issued", schemeId: scheme!.id, requestedBy: people.engineer.id,
        approvedBy: people.coordinator.id, issuedAt: new Date(o.validUntil.getTime() - 7 * 86_400_000), validUntil: o.validUntil,
        recipients: o.recipients ?? [people.supervisor.email, people.engineer.email],
      })
      .returning();
    await db.insert(permitMembers).values(o.memberIds.map((memberId) => ({ permitId: p!.id, memberId })));
    return p!;
  }

  return { tag, org: org!, site: site!, people, zoneA: zoneA!, zoneB: zoneB!, scheme: scheme!, types: { strong: strong!, weak: weak! }, addMember, addInspection, addPermit };
}
