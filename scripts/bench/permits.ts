// Issuing a permit to load, end to end in this process: the transaction (row locks, number,
// members loaded, audit, e-mails queued) + rendering the PDF + storing it in S3 + releasing the
// e-mails. Measured on the demo site of whatever stack DATABASE_URL and S3_* point at (a test or
// bench slot: it adds its own members and permits there).
//
//   STRUTWISE_TEST_SLOT=4 node --import tsx --import ./scripts/server-only-hook.mjs scripts/bench/permits.ts
//   (with the slot's environment exported; it refuses the `npm start` database)
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { getSessionUser } from "@/db/queries/users";
import { checks, inspections, memberTypes, members, photos, schemes, sites, users, zones } from "@/db/schema";
import { issuePermit, requestPermit } from "@/lib/permits";
import { RESOURCES } from "@/lib/api/resources";
import { runCheck } from "@/lib/register/run-check";
import { permitRequestSchema } from "@/lib/validations/permit";

export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  goal?: string;
}

const ISSUES = Number(process.env.BENCH_PERMITS ?? 30);
const MEMBERS_PER_PERMIT = 4;

async function demo() {
  const [site] = await db.select().from(sites).where(eq(sites.name, "Wexcombe Wharf — Block B"));
  if (!site) throw new Error("the demo site is not in this database; seed it first");
  const [type] = await db.select().from(memberTypes).where(and(eq(memberTypes.organisationId, site.organisationId), eq(memberTypes.name, "EN 1065 class B prop, 1.75–3.12 m")));
  const [zone] = await db.select().from(zones).where(and(eq(zones.siteId, site.id), eq(zones.name, "Level 2 slab, bays 1–4")));
  const [scheme] = await db.select().from(schemes).where(and(eq(schemes.siteId, site.id), eq(schemes.reference, "TW-WXW-014")));
  const person = async (email: string) => {
    const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
    return (await getSessionUser({ id: u!.id }))!;
  };
  return { site, type: type!, zone: zone!, scheme: scheme!, engineer: await person("engineer@demo.example"), coordinator: await person("coordinator@demo.example") };
}

/** Members ready to load: passing check (the engine's), a ready photo, an in-date passed inspection. */
async function readyMembers(d: Awaited<ReturnType<typeof demo>>, n: number, run: string) {
  const ids: string[] = [];
  for (let i = 0; i < n; i++) {
    const base = {
      siteId: d.site.id, tag: `BENCH-${run}-${i}`, zoneId: d.zone.id, schemeId: d.scheme.id, memberTypeId: d.type.id,
      extensionMm: 2400 + (i % 5) * 40, endConditions: "pinned-pinned" as const, loadN: 6000 + (i % 3) * 500, status: "submitted" as const,
    };
    const o = runCheck(d.type, base, d.site);
    if (!o.pass) throw new Error(`bench member ${base.tag} does not pass its check`);
    const [m] = await db.insert(members).values({ ...base, capacityN: o.capacityN, utilisation: o.utilisation, checkPass: o.pass }).returning({ id: members.id });
    const [c] = await db.insert(checks).values({ memberId: m!.id, method: o.method, reason: "bench", inputs: o.inputs, result: o.result, capacityN: o.capacityN, utilisation: o.utilisation, pass: o.pass, engineVersion: o.engineVersion }).returning({ id: checks.id });
    await db.update(members).set({ latestCheckId: c!.id }).where(eq(members.id, m!.id));
    await db.insert(photos).values({ siteId: d.site.id, memberId: m!.id, objectKey: `bench/${m!.id}.jpg`, status: "ready" });
    await db.insert(inspections).values({ siteId: d.site.id, memberId: m!.id, result: "pass", inspectedAt: new Date(), nextDueAt: new Date(Date.now() + 7 * 86_400_000) });
    ids.push(m!.id);
  }
  return ids;
}

export async function benchPermitIssue(): Promise<BenchRow[]> {
  if (process.env.STRUTWISE_PROFILE !== "test" && !process.env.BENCH_PERMITS_DATABASE_OK)
    throw new Error("benchPermitIssue adds permits to the database it is given; run it against a test or bench slot (STRUTWISE_PROFILE=test)");
  const d = await demo();
  const run = Date.now().toString(36).toUpperCase();
  const ids = await readyMembers(d, ISSUES * MEMBERS_PER_PERMIT, run);
  const permitIds: string[] = [];
  for (let i = 0; i < ISSUES; i++) {
    const input = permitRequestSchema.parse({ kind: "load", scope: "members", memberIds: ids.slice(i * MEMBERS_PER_PERMIT, (i + 1) * MEMBERS_PER_PERMIT) });
    const p = await requestPermit({ user: d.engineer, site: d.site, input });
    permitIds.push(p.id);
  }
  // One warm-up issue (fonts load, PDF layout code compiles), not counted.
  const times: number[] = [];
  for (const [i, id] of permitIds.entries()) {
    const t = performance.now();
    // The context the route's seam would hand over: the coordinator, the permit, no body.
    const loaded = await RESOURCES.permit.load(d.coordinator, { permitId: id });
    const r = await issuePermit({ req: new Request("http://bench.invalid/"), user: d.coordinator, ...loaded, input: {} });
    const ms = performance.now() - t;
    if (!r.pdfReady) throw new Error(`permit ${id} was issued without its PDF`);
    if (i > 0) times.push(ms);
  }
  times.sort((a, b) => a - b);
  const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!;
  return [
    { name: `permit issue (${MEMBERS_PER_PERMIT} members): transaction + PDF + S3 + queue, p95`, value: Math.round(q(0.95)), unit: "ms", goal: "<= 300 ms" },
    { name: `permit issue (${MEMBERS_PER_PERMIT} members): p50`, value: Math.round(q(0.5)), unit: "ms" },
  ];
}

// Standalone: print the rows.
if (import.meta.url === `file://${process.argv[1]}`) {
  try {
    for (const r of await benchPermitIssue()) console.log(`${r.name.padEnd(80)} ${String(r.value).padStart(8)} ${r.unit}${r.goal ? `  (goal ${r.goal})` : ""}`);
  } finally {
    await sql.end({ timeout: 5 });
  }
}
