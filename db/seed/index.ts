// Seeds the demo scenario. `--if-empty` (used by `npm start`) leaves a database with data alone.
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { count, eq } from "drizzle-orm";
import * as schema from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { checkSnapshot, runCheck } from "@/lib/register/run-check";
import {
  DEMO_MEMBER_TYPES, DEMO_ORG, DEMO_PASSWORD, DEMO_SITES, DEMO_USERS, OTHER_ORG, OTHER_SITE, OTHER_USERS,
} from "./data";
import { seedCertificates } from "./certificates";
import { seedInspections } from "./inspections";
import { seedPhotos } from "./photos";
import { DEMO_OFF_PLAN, seedZonePlans } from "./plans";

const url = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:55432/strutwise";
const client = postgres(url, { max: 2, onnotice: () => {} });
const db = drizzle(client, { schema });
const {
  organisations, users, sites, memberships, zones, schemes, memberTypes, members, checks, permits, permitMembers,
} = schema;

const HOUR = 3600_000;
const DAY = 24 * HOUR;

export async function seed() {
  const now = Date.now();
  const passwordHash = await hashPassword(DEMO_PASSWORD);

  return db.transaction(async (tx) => {
    const [org] = await tx.insert(organisations).values(DEMO_ORG).returning();
    const [other] = await tx.insert(organisations).values(OTHER_ORG).returning();

    const people: Record<string, typeof users.$inferSelect> = {};
    for (const u of DEMO_USERS) {
      const [row] = await tx
        .insert(users)
        .values({ organisationId: org!.id, email: u.email, name: u.name, passwordHash, isOrgAdmin: "orgAdmin" in u && u.orgAdmin })
        .returning();
      people[u.role] = row!;
    }
    const [otherAdmin] = await tx
      .insert(users)
      .values({ organisationId: other!.id, email: OTHER_USERS[0].email, name: OTHER_USERS[0].name, passwordHash, isOrgAdmin: true })
      .returning();
    const [otherSite] = await tx.insert(sites).values({ organisationId: other!.id, ...OTHER_SITE }).returning();
    await tx.insert(memberships).values({ userId: otherAdmin!.id, siteId: otherSite!.id, role: "admin" });
    await tx.insert(zones).values({ siteId: otherSite!.id, name: "Ground floor slab", level: "L0" });

    const types: Record<string, typeof memberTypes.$inferSelect> = {};
    for (const t of DEMO_MEMBER_TYPES) {
      const [row] = await tx
        .insert(memberTypes)
        .values({
          organisationId: org!.id,
          name: t.name,
          kind: t.kind,
          supplier: t.supplier,
          params: t.params as unknown as Record<string, unknown>,
          minExtensionMm: t.min,
          maxExtensionMm: t.max,
        })
        .returning();
      types[t.key] = row!;
    }

    const siteRows: Record<string, typeof sites.$inferSelect> = {};
    const zoneRows: Record<string, typeof zones.$inferSelect> = {};
    const schemeRows: Record<string, typeof schemes.$inferSelect> = {};
    for (const s of DEMO_SITES) {
      const [site] = await tx.insert(sites).values({ organisationId: org!.id, name: s.name, code: s.code, address: s.address }).returning();
      siteRows[s.key] = site!;
      for (const u of DEMO_USERS) await tx.insert(memberships).values({ userId: people[u.role]!.id, siteId: site!.id, role: u.role });
      for (const z of s.zones) {
        const [zone] = await tx.insert(zones).values({ siteId: site!.id, name: z.name, level: z.level, grid: z.grid, area: z.area }).returning();
        zoneRows[`${s.key}.${z.key}`] = zone!;
      }
      for (const sc of s.schemes) {
        const [row] = await tx
          .insert(schemes)
          .values({
            siteId: site!.id,
            reference: sc.reference,
            title: sc.title,
            designerName: people.designer!.name,
            designerUserId: people.designer!.id,
            category: sc.category,
            designLoadN: sc.designLoadN,
            designSpacingXMm: sc.spacingMm,
            designSpacingYMm: sc.spacingMm,
            slabThicknessMm: sc.slabThicknessMm,
            validFrom: new Date(now - 30 * DAY),
            validUntil: new Date(now + 90 * DAY),
            createdBy: people.designer!.id,
          })
          .returning();
        schemeRows[`${s.key}.${sc.key}`] = row!;
      }
    }

    const memberIds: Record<string, string[]> = {};
    async function addMembers(
      group: string,
      opts: {
        site: string; zone: string; scheme: string | null; type: string; prefix: string; n: number;
        status: (typeof schema.memberStatus.enumValues)[number];
        extension: (i: number) => number; load: (i: number) => number;
        ends?: (typeof schema.endCondition.enumValues)[number]; spacing?: number; override?: (i: number) => Partial<typeof members.$inferInsert>;
      },
    ) {
      const site = siteRows[opts.site]!;
      const type = types[opts.type]!;
      memberIds[group] = [];
      for (let i = 1; i <= opts.n; i++) {
        const base = {
          siteId: site.id,
          tag: `${opts.prefix}${String(i).padStart(2, "0")}`,
          zoneId: zoneRows[`${opts.site}.${opts.zone}`]!.id,
          schemeId: opts.scheme ? schemeRows[`${opts.site}.${opts.scheme}`]!.id : null,
          memberTypeId: type.id,
          extensionMm: opts.extension(i),
          endConditions: opts.ends ?? "pinned-pinned",
          spacingXMm: opts.spacing ?? null,
          spacingYMm: opts.spacing ?? null,
          loadN: opts.load(i),
          status: opts.status,
          installedBy: people.engineer!.id,
          installedAt: new Date(now - (10 - (i % 5)) * DAY),
          createdBy: people.engineer!.id,
          ...(opts.override?.(i) ?? {}),
        };
        const outcome = runCheck(type, base, site);
        const [m] = await tx
          .insert(members)
          .values({ ...base, capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass })
          .returning({ id: members.id });
        const [c] = await tx
          .insert(checks)
          .values({
            memberId: m!.id,
            reason: "logged",
            ...checkSnapshot(outcome),
            createdBy: people.engineer!.id,
          })
          .returning({ id: checks.id });
        await tx.update(members).set({ latestCheckId: c!.id }).where(eq(members.id, m!.id));
        memberIds[group]!.push(m!.id);
      }
    }

    // Wexcombe Wharf: back-props under the L2 pour, a transfer-beam falsework, struck L3 props.
    await addMembers("l1", {
      site: "wharf", zone: "l1", scheme: "bp", type: "propD", prefix: "WXW-L1-P", n: 12, status: "loaded", spacing: 1200,
      extension: (i) => 2650 + (i % 4) * 60, load: (i) => 11200 + (i % 3) * 400,
      override: (i) => (i === 11 ? { status: "out_of_service", notes: "Inner tube bent by a pallet truck; replaced by P12." } : {}),
    });
    await addMembers("l2", {
      site: "wharf", zone: "l2", scheme: "bp", type: "propB", prefix: "WXW-L2-P", n: 8, status: "submitted", spacing: 1200,
      extension: (i) => (i === 8 ? 3100 : 2500 + (i % 3) * 80), load: (i) => (i === 8 ? 19000 : 7000 + (i % 2) * 500),
    });
    await addMembers("tb", {
      site: "wharf", zone: "tb", scheme: "fw", type: "heavy", prefix: "WXW-TB-S", n: 6, status: "draft",
      extension: (i) => 2800 + i * 40, load: (i) => 52000 + i * 500,
    });
    await addMembers("l3", {
      site: "wharf", zone: "l3", scheme: "l3", type: "propE", prefix: "WXW-L3-P", n: 6, status: "struck", spacing: 1200,
      extension: (i) => 3000 + i * 50, load: () => 10500,
    });
    // Orchard Row: raking struts to the north wall, trench struts in the lift pit, timber posts.
    await addMembers("rs", {
      site: "orchard", zone: "nw", scheme: "rs", type: "chs", prefix: "ORB-RS-", n: 6, status: "submitted", ends: "pinned-pinned",
      extension: (i) => 5000 + i * 60, load: (i) => 240000 + i * 2000,
    });
    await addMembers("ts", {
      site: "orchard", zone: "pit", scheme: "ts", type: "trench", prefix: "ORB-TS-", n: 4, status: "loaded",
      extension: (i) => 1150 + i * 20, load: () => 21000,
    });
    await addMembers("tp", {
      site: "orchard", zone: "ramp", scheme: null, type: "timber", prefix: "ORB-TP-", n: 3, status: "draft",
      extension: () => 2400, load: (i) => 30000 + i * 5000,
    });

    await seedInspections(tx, { memberIds, inspectorId: people.engineer!.id, now });
    await seedCertificates(tx, { designerName: people.designer!.name, now });
    await seedPhotos(tx, { uploadedBy: people.engineer!.id, now });
    await seedZonePlans(tx, { uploadedBy: people.designer!.id, now, leaveOff: DEMO_OFF_PLAN });

    async function addPermit(p: {
      site: string; kind: "load" | "strike"; status: (typeof schema.permitStatus.enumValues)[number]; number: number | null;
      scheme: string; zone: string; group: string; take?: number; issuedDaysAgo?: number; validDays?: number; conditions?: string;
      evidence?: Record<string, unknown>;
    }) {
      const site = siteRows[p.site]!;
      const issued = p.number != null;
      // Each request's own number on its site, in the order the demo makes them.
      site.requestCounter += 1;
      await tx.update(sites).set({ requestCounter: site.requestCounter }).where(eq(sites.id, site.id));
      const issuedAt = issued ? new Date(now - (p.issuedDaysAgo ?? 1) * DAY) : null;
      const [row] = await tx
        .insert(permits)
        .values({
          siteId: site.id,
          kind: p.kind,
          number: p.number,
          requestNumber: site.requestCounter,
          status: p.status,
          schemeId: schemeRows[`${p.site}.${p.scheme}`]!.id,
          zoneId: zoneRows[`${p.site}.${p.zone}`]!.id,
          requestedBy: people.engineer!.id,
          requestedAt: new Date(now - ((p.issuedDaysAgo ?? 0) + 0.2) * DAY),
          approvedBy: issued ? people.coordinator!.id : null,
          issuedAt,
          validUntil: issuedAt ? new Date(issuedAt.getTime() + (p.validDays ?? 7) * DAY) : null,
          conditions: p.conditions ?? null,
          evidence: p.evidence ?? null,
          recipients: issued ? [people.supervisor!.email, people.engineer!.email] : [],
          closedAt: p.status === "closed" ? new Date(now - 1 * DAY) : null,
          closedBy: p.status === "closed" ? people.coordinator!.id : null,
        })
        .returning();
      const ids = memberIds[p.group]!.slice(0, p.take ?? undefined);
      await tx.insert(permitMembers).values(ids.map((memberId) => ({ permitId: row!.id, memberId })));
      if (issued) {
        const counter = Math.max(site.permitCounter, p.number!);
        site.permitCounter = counter;
        await tx.update(sites).set({ permitCounter: counter }).where(eq(sites.id, site.id));
      }
    }

    await addPermit({
      site: "wharf", kind: "strike", status: "closed", number: 1, scheme: "l3", zone: "l3", group: "l3", issuedDaysAgo: 6, validDays: 3,
      evidence: { basis: "cube results", ageDays: 10, requiredStrengthMpa: 20, achievedStrengthMpa: 27.5, note: "Two 7-day cubes, mean 27.5 MPa" },
    });
    await addPermit({
      site: "wharf", kind: "load", status: "issued", number: 2, scheme: "bp", zone: "l1", group: "l1", take: 10, issuedDaysAgo: 2, validDays: 7,
      conditions: "Pour L2 bay 1 before bay 2. Keep P11 out of use; P12 replaces it.",
    });
    await addPermit({ site: "wharf", kind: "load", status: "requested", number: null, scheme: "bp", zone: "l2", group: "l2", take: 7 });
    await addPermit({ site: "orchard", kind: "load", status: "issued", number: 1, scheme: "ts", zone: "pit", group: "ts", issuedDaysAgo: 1, validDays: 5 });

    return { organisation: org!.name, sites: Object.values(siteRows).map((s) => s.name) };
  });
}

const ifEmpty = process.argv.includes("--if-empty");
try {
  const [existing] = await db.select({ n: count() }).from(organisations);
  if (ifEmpty && existing!.n > 0) {
    console.log("[seed] database already has data; left as it is");
  } else {
    const out = await seed();
    console.log(`[seed] demo data for ${out.organisation}: ${out.sites.join(", ")}`);
  }
} finally {
  await client.end();
}
