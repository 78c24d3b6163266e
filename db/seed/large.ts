// `npm run db:seed:large`: a third demo site, "Harbour Lane Multi-storey", with 20,000 members (each with
// a real stored check from the engine) so the register, export and benchmarks run at full size.
// Needs the demo organisation (`npm run db:seed` or `npm start` first). Refuses, changing nothing,
// when the site is already there. The whole seed is one transaction: it is there in full or not at all.
import { randomUUID } from "node:crypto";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { and, eq } from "drizzle-orm";
import * as schema from "@/db/schema";
import { checkSnapshot, runCheck } from "@/lib/register/run-check";
import { DEMO_ORG, DEMO_USERS } from "./data";

export const LARGE_SITE = { name: "Harbour Lane Multi-storey", code: "HLM", address: "Harbour Lane, Wexcombe" };
export const LARGE_MEMBER_COUNT = Number(process.env.LARGE_SEED_MEMBERS ?? 20000);

const { organisations, users, sites, memberships, zones, schemes, memberTypes, members, checks } = schema;
type Status = (typeof schema.memberStatus.enumValues)[number];
type Ends = (typeof schema.endCondition.enumValues)[number];

/** Deterministic pseudo-random numbers (mulberry32) so every seeded database is the same. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const LEVELS = 10;
const BAYS = ["North bays", "South bays", "Ramp", "Core"] as const;
const DAY = 86_400_000;

export async function seedLarge(url: string, count = LARGE_MEMBER_COUNT) {
  const client = postgres(url, { max: 2, onnotice: () => {} });
  const db = drizzle(client, { schema });
  try {
    const [org] = await db.select().from(organisations).where(eq(organisations.slug, DEMO_ORG.slug));
    if (!org) throw new Error("The demo organisation is not in this database; run `npm run db:seed` (or `npm start`) first.");
    const [existing] = await db
      .select({ id: sites.id })
      .from(sites)
      .where(and(eq(sites.organisationId, org.id), eq(sites.code, LARGE_SITE.code)));
    if (existing) return { created: false as const, siteId: existing.id };

    const people = await db.select({ id: users.id, email: users.email }).from(users).where(eq(users.organisationId, org.id));
    const byEmail = new Map(people.map((p) => [p.email, p.id]));
    const types = await db.select().from(memberTypes).where(eq(memberTypes.organisationId, org.id));
    const props = types.filter((t) => t.kind === "en1065-prop" || t.kind === "supplier-table" || t.kind === "timber-section");
    if (props.length === 0) throw new Error("The demo member library is empty; run `npm run db:seed` first.");
    const engineerId = byEmail.get("engineer@demo.example") ?? null;
    const designer = DEMO_USERS.find((u) => u.role === "designer")!;

    const seeded = await db.transaction(async (tx) => {
      const [site] = await tx.insert(sites).values({ organisationId: org.id, ...LARGE_SITE }).returning();
      for (const u of DEMO_USERS) {
        const userId = byEmail.get(u.email);
        if (userId) await tx.insert(memberships).values({ userId, siteId: site!.id, role: u.role });
      }
      const zoneRows = await tx
        .insert(zones)
        .values(
          Array.from({ length: LEVELS * BAYS.length }, (_, i) => {
            const level = `L${String(Math.floor(i / BAYS.length) + 1).padStart(2, "0")}`;
            const bay = BAYS[i % BAYS.length]!;
            return { siteId: site!.id, name: `${level} ${bay}`, level, area: bay };
          }),
        )
        .returning({ id: zones.id, level: zones.level });
      const now = Date.now();
      const schemeRows = await tx
        .insert(schemes)
        .values(
          Array.from({ length: 5 }, (_, i) => ({
            siteId: site!.id,
            reference: `TW-HLM-${String(i + 1).padStart(3, "0")}`,
            title: `Deck propping, levels ${i * 2 + 1}–${i * 2 + 2}`,
            designerName: designer.name,
            designerUserId: byEmail.get(designer.email) ?? null,
            category: 2,
            designLoadN: 24000,
            designSpacingXMm: 1200,
            designSpacingYMm: 1200,
            slabThicknessMm: 250,
            validFrom: new Date(now - 30 * DAY),
            validUntil: new Date(now + 120 * DAY),
          })),
        )
        .returning({ id: schemes.id });

      const random = rng(20_000);
      const statuses: Status[] = ["draft", "submitted", "submitted", "loaded", "loaded", "loaded", "struck", "out_of_service"];
      const ends: Ends[] = ["pinned-pinned", "pinned-pinned", "pinned-pinned", "fixed-pinned"];
      const BATCH = 1000;
      for (let start = 0; start < count; start += BATCH) {
        const memberRows: (typeof members.$inferInsert)[] = [];
        const checkRows: (typeof checks.$inferInsert)[] = [];
        for (let i = start; i < Math.min(count, start + BATCH); i++) {
          const zoneIndex = i % zoneRows.length;
          const zone = zoneRows[zoneIndex]!;
          const type = props[i % props.length]!;
          const min = type.minExtensionMm ?? 2000;
          const max = type.maxExtensionMm ?? 3600;
          // Most members sit inside the type's range; about 1 in 200 struts is measured beyond its
          // supplier's table (the engine refuses it, so it is failing with no capacity). A
          // telescopic prop cannot sit outside its range, so props never are.
          const outside = type.kind !== "en1065-prop" && random() < 0.01;
          const extensionMm = Math.round(outside ? max + 50 + random() * 300 : min + random() * (max - min));
          // Loads mostly well within capacity; a few members are overloaded on purpose.
          const loadN = Math.round((random() < 0.04 ? 30000 + random() * 40000 : 4000 + random() * 16000) / 10) * 10;
          const memberId = randomUUID();
          const checkId = randomUUID();
          const base = { extensionMm, endConditions: ends[i % ends.length]!, loadN };
          const outcome = runCheck(type, base, site!);
          const touched = new Date(now - random() * 60 * DAY);
          memberRows.push({
            id: memberId,
            siteId: site!.id,
            tag: `HL-${zone.level}-${String(i + 1).padStart(5, "0")}`,
            schemeId: schemeRows[Math.floor(zoneIndex / (zoneRows.length / schemeRows.length))]!.id,
            zoneId: zone.id,
            memberTypeId: type.id,
            ...base,
            spacingXMm: 1200,
            spacingYMm: 1200,
            status: outcome.pass ? statuses[Math.floor(random() * statuses.length)]! : random() < 0.5 ? "out_of_service" : "draft",
            latestCheckId: checkId,
            capacityN: outcome.capacityN,
            utilisation: outcome.utilisation,
            checkPass: outcome.pass,
            installedBy: engineerId,
            installedAt: touched,
            createdBy: engineerId,
            createdAt: touched,
            updatedAt: touched,
          });
          checkRows.push({
            id: checkId,
            memberId,
            reason: "logged",
            ...checkSnapshot(outcome),
            createdBy: engineerId,
            createdAt: touched,
          });
        }
        await tx.insert(members).values(memberRows);
        await tx.insert(checks).values(checkRows);
      }
      return { created: true as const, siteId: site!.id };
    });
    // Fresh statistics and visibility map, as a site that has been in use has: the planner's
    // estimates and the index-only counts are those of normal running from the first request.
    await client`vacuum (analyze) members, checks`;
    return seeded;
  } finally {
    await client.end();
  }
}

// Run as a script (not when imported by the benchmark).
if (process.argv[1] && /db[\\/]seed[\\/]large\.ts$/.test(process.argv[1])) {
  const url = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:55432/strutwise";
  const t0 = Date.now();
  try {
    const out = await seedLarge(url);
    if (out.created) {
      console.log(`[seed:large] ${LARGE_SITE.name}: ${LARGE_MEMBER_COUNT} members with checks in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    } else {
      console.log(`[seed:large] ${LARGE_SITE.name} is already seeded (site ${out.siteId}); nothing changed.`);
    }
  } catch (e) {
    console.error(`[seed:large] ${(e as Error).message}`);
    process.exitCode = 1;
  }
}
