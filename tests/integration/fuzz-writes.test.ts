// Property-based: thousands of generated malformed bodies across every write route the app
// declares (discovered from app/api/**/route.ts and the seam's metadata, so a new route is covered
// the day it is added). Each must be refused with a 4xx — never a 5xx — and nothing may be stored.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { memberships, organisations, users } from "@/db/schema";
import type { RouteMeta } from "@/lib/api/route";
import { hashPassword } from "@/lib/auth/password";
import { declaredRoutes } from "../support/routes";
import { DEMO_PASSWORD, signInAs, type Client } from "../support/http";
import { makeMember, requestLoad, site, uniqueTag } from "../support/fixtures";
import { ALL_METHOD_IDS } from "@/lib/engineering/types";

const ROLES = ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"] as const;
const WRITE = ["POST", "PUT", "PATCH", "DELETE"] as const;
const TOTAL_RUNS = 2000;

type Parser = NonNullable<RouteMeta["parser"]>;
type WriteRoute = { method: (typeof WRITE)[number]; template: string; meta: RouteMeta };

/** The write routes that read a body, with a URL template such as /api/v1/sites/[siteId]/zones. */
async function discover(): Promise<WriteRoute[]> {
  const routes = await declaredRoutes({ skip: ["app/api/auth/[...nextauth]/route.ts"] });
  return routes.flatMap((r) =>
    (WRITE as readonly string[]).includes(r.method) && r.meta && r.meta.body !== "none"
      ? [{ method: r.method as WriteRoute["method"], template: r.url, meta: r.meta }]
      : [],
  );
}

/** Whether the route's own parser would take this body: such bodies are valid and not sent. */
function accepts(parser: Parser | undefined, value: unknown): boolean {
  if (!parser) return false;
  if (typeof parser === "function") {
    try {
      parser(value);
      return true;
    } catch {
      return false;
    }
  }
  return parser.safeParse(value).success;
}

const anyJson = fc.jsonValue({ maxDepth: 2 });
const nastyString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom("", "NaN", "Infinity", "-0", "1e400", "null", "<script>x</script>", "'; drop table members; --", "\u0000", "😀".repeat(20)),
);
const nastyValue = fc.oneof(anyJson, nastyString, fc.constantFrom(Number.MAX_SAFE_INTEGER, -1, 0, 1.5, 1e308, true, false, null));
/** Objects with the keys a write route might read, holding values of the wrong kind. */
const likelyKeys = fc.constantFrom(
  "tag", "memberTypeId", "extensionMm", "endConditions", "loadSource", "loadN", "spacingXMm", "spacingYMm", "zoneId", "schemeId",
  "notes", "photoIds", "submit", "status", "contentType", "size", "kind", "scope", "memberIds", "evidence", "validUntil", "conditions",
  "reason", "result", "items", "name", "code", "email", "roles", "password", "units", "basis", "reference", "category", "userId", "zoneIds",
  "preferences", "planPosition", "key", "method",
);
const wrongObject = fc.dictionary(likelyKeys, nastyValue, { maxKeys: 6 });

function bodyFor(route: WriteRoute): fc.Arbitrary<{ text: string; type: string }> {
  if (route.meta.body === "raw") return fc.oneof(fc.string({ maxLength: 300 }), fc.constant("tag,zone\n,\n")).map((text) => ({ text, type: "text/csv" }));
  // A body the route's own parser would take is valid, not malformed: wrap it in an array (never a
  // JSON object, so always refused) rather than filtering, which could spin on permissive schemas.
  const isEmptyObject = (v: unknown) => v !== null && typeof v === "object" && !Array.isArray(v) && Object.keys(v).length === 0;
  const json = fc
    .oneof(wrongObject, fc.object({ maxDepth: 2, maxKeys: 5 }), anyJson)
    // Judged as the server will see it: JSON drops undefined values ({ a: undefined } is sent as {}).
    .map((v) => (v === undefined ? null : JSON.parse(JSON.stringify(v)) as unknown))
    .map((v) => (accepts(route.meta.parser, v) || (route.meta.body === "optional-json" && isEmptyObject(v)) ? [v] : v))
    .map((v) => ({ text: JSON.stringify(v), type: "application/json" }));
  const notJson = fc.constantFrom("{", "not json", "{'a':1}", "[1,", "\u0000").map((text) => ({ text, type: "application/json" }));
  return fc.oneof({ arbitrary: json, weight: 5 }, { arbitrary: notJson, weight: 1 });
}

/** A camelCase word is a request key (eMpa, timberType, slabThicknessMm), not words; kN, kPa and kNm are units. */
const CAMEL = /\b[a-z][a-z0-9]*[A-Z][A-Za-z0-9]*\b/g;
const UNIT_WORDS = new Set(["kN", "kPa", "kNm"]);
function codeWordsIn(answer: string): string[] {
  let parsed: { error?: { message?: string; fields?: Record<string, string> } };
  try {
    parsed = JSON.parse(answer) as typeof parsed;
  } catch {
    return [];
  }
  const messages = [parsed.error?.message ?? "", ...Object.values(parsed.error?.fields ?? {})];
  // What the sender typed is echoed in quotes ('got the text "aB"'): that is their text, not our field name.
  return messages.filter((m) => (m.replace(/"[^"]*"|“[^”]*”/g, "").match(CAMEL) ?? []).some((w) => !UNIT_WORDS.has(w)));
}

let everyRole: Client;
let ids: Record<string, string>;

async function counts() {
  const [row] = await sql`select
    (select count(*) from audit_events)::int as audit, (select count(*) from members)::int as members,
    (select count(*) from photos)::int as photos, (select count(*) from permits)::int as permits,
    (select count(*) from inspections)::int as inspections, (select count(*) from outbox)::int as outbox,
    (select count(*) from zones)::int as zones, (select count(*) from schemes)::int as schemes,
    (select count(*) from member_types)::int as types, (select count(*) from users)::int as users`;
  return row;
}

beforeAll(async () => {
  // One person holding every role on the wharf, so every route gets past its role check to its input.
  const wharf = await site();
  const [org] = await db.select().from(organisations).where(eq(organisations.id, wharf.organisationId));
  const email = `${uniqueTag("fuzz")}@demo.example`.toLowerCase();
  const [u] = await db.insert(users).values({ organisationId: org!.id, email, name: "Fuzz Every Role", passwordHash: await hashPassword(DEMO_PASSWORD) }).returning();
  await db.insert(memberships).values(ROLES.map((role) => ({ userId: u!.id, siteId: wharf.id, role })));
  everyRole = await signInAs(email);
  const m = await makeMember();
  const permitId = await requestLoad({ memberIds: [m.id], siteId: wharf.id });
  const first = async (q: Promise<readonly { id?: unknown }[]>) => ((await q)[0]?.id as string | undefined) ?? "00000000-0000-4000-8000-000000000000";
  ids = {
    siteId: wharf.id,
    memberId: m.id,
    permitId,
    photoId: await first(sql`select id from photos where site_id = ${wharf.id} limit 1`),
    delegationId: await first(sql`select id from permit_delegations where site_id = ${wharf.id} limit 1`),
    alertId: await first(sql`select id from alerts where site_id = ${wharf.id} limit 1`),
    zoneId: await first(sql`select id from zones where site_id = ${wharf.id} limit 1`),
    schemeId: await first(sql`select id from schemes where site_id = ${wharf.id} limit 1`),
    typeId: await first(sql`select id from member_types where organisation_id = ${wharf.organisationId} limit 1`),
    userId: u!.id,
    token: "fuzz-token-that-matches-nothing-0123456789abcdef",
  };
});

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

describe("malformed bodies on every write route", () => {
  it(`${TOTAL_RUNS}+ generated bodies: each a 4xx with a reason, none a 5xx, nothing stored`, async () => {
    const routes = await discover();
    expect(routes.length).toBeGreaterThan(25);
    const perRoute = Math.max(20, Math.ceil(TOTAL_RUNS / routes.length));
    const before = await counts();
    let sent = 0;
    for (const route of routes) {
      const url = route.template.replace(/\[(\w+)\]/g, (_, name: string) => {
        // A parameter with no fixture (an invitation, say) gets an id that matches nothing: still a 4xx.
        return ids[name] ?? "00000000-0000-4000-8000-000000000000";
      });
      await fc.assert(
        fc.asyncProperty(bodyFor(route), async ({ text, type }) => {
          const res = await everyRole.fetch(url, { method: route.method, headers: { "content-type": type }, body: text });
          sent++;
          const answer = await res.text();
          if (res.status >= 500 || res.status < 400) throw new Error(`${route.method} ${route.template} answered ${res.status} to ${text.slice(0, 200)}: ${answer.slice(0, 300)}`);
          const parsed = JSON.parse(answer) as { error?: { code?: string; message?: string } };
          if (!parsed.error?.message) throw new Error(`${route.method} ${route.template} gave no reason for ${res.status}: ${answer.slice(0, 200)}`);
          const coded = codeWordsIn(answer);
          if (coded.length) throw new Error(`${route.method} ${route.template} names a code field to ${text.slice(0, 200)}: ${coded.join(" | ")}`);
        }),
        // No shrinking: the first failure is reported as it was sent (shrinking would replay hundreds of requests).
        { numRuns: perRoute, endOnFailure: true },
      );
    }
    expect(sent).toBeGreaterThanOrEqual(TOTAL_RUNS);
    expect(await counts()).toEqual(before);
  }, 600_000);
});

// Issue #16: a refusal reaches a person, so it is a sentence in words ("Slab thickness", "the photos"),
// never a request key. Every write route gets each key a route reads, all holding the same wrong kind of
// value, so each schema answers for all its fields at once; then every calculation method gets the same.
describe("no refusal names a code field", () => {
  const KEYS = [
    "tag", "memberTypeId", "extensionMm", "endConditions", "loadSource", "loadN", "spacingXMm", "spacingYMm", "zoneId", "schemeId", "notes", "photoIds",
    "submit", "status", "contentType", "size", "kind", "scope", "memberIds", "evidence", "validUntil", "validFrom", "conditions", "reason", "result", "items",
    "name", "code", "email", "roles", "password", "units", "basis", "reference", "category", "userId", "zoneIds", "preferences", "planPosition", "key",
    "method", "clientId", "baseVersion", "scale", "archived", "params", "title", "designerName", "designLoadN", "slabThicknessMm", "concreteDensityKnM3",
    "formworkKnM2", "constructionKnM2", "base", "plumbDeg", "plumbOffsetMm", "plumbOverMm", "timezone", "unitSystem", "startCell", "checkerName",
    "checkCategory", "documentDate", "drawingNumber", "revision", "signedImageConfirmed", "currentPassword", "newPassword", "token",
  ];
  const WRONG: unknown[] = ["x", -1, 1e12, true, [1], { a: 1 }, null, ""];
  const bodies = WRONG.map((v) => Object.fromEntries(KEYS.map((k) => [k, v])));
  // The library's kinds each have their own params: one body per kind with every param wrong.
  for (const kind of ["en1065-prop", "supplier-table", "trench-strut", "steel-section", "timber-section"]) {
    bodies.push({ kind, name: "x", params: { propClass: 1, table: [{ lengthMm: "x", safeLoadN: -1 }], section: { shape: "chs", dMm: "x", tMm: -1 }, grade: 1, formed: 1, strengthClass: 1, timberType: 1 }, minExtensionMm: "x", maxExtensionMm: -1 });
  }

  it("every write route refuses each wrongly typed field in words", async () => {
    const routes = (await discover()).filter((r) => r.meta.body !== "raw");
    const offenders: string[] = [];
    let refusals = 0;
    for (const route of routes) {
      const url = route.template.replace(/\[(\w+)\]/g, (_, name: string) => ids[name] ?? "00000000-0000-4000-8000-000000000000");
      for (const body of bodies) {
        if (accepts(route.meta.parser, body)) continue; // never send a body the route would take
        const res = await everyRole.fetch(url, { method: route.method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
        const answer = await res.text();
        expect(res.status, `${route.method} ${route.template}`).toBeGreaterThanOrEqual(400);
        if (res.status === 422) refusals++;
        offenders.push(...codeWordsIn(answer).map((m) => `${route.method} ${route.template}: ${m}`));
      }
    }
    expect(refusals).toBeGreaterThan(100);
    expect([...new Set(offenders)]).toEqual([]);
  }, 300_000);

  it("every calculation method refuses malformed requests in words", async () => {
    const FIELDS = [
      "lengthMm", "k", "ends", "section", "eMpa", "fyMpa", "steelGrade", "formed", "curve", "gammaM1", "fc0kMpa", "e005Mpa", "kmod", "serviceClass",
      "loadDuration", "gammaM", "betaC", "strengthClass", "timberType", "fcStarMpa", "eMinMpa", "c", "propClass", "maxExtensionMm", "minExtensionMm", "gammaF",
      "table", "braces", "designBasis", "loadN", "hssWeld", "fyFrom", "duringConstruction", "supplierInterpolation", "outOfPlumbDeg", "outOfPlumbMm",
      "eccentricityMm", "plumbCode", "basePlateBMm", "basePlateLMm", "solePlateBMm", "solePlateLMm", "solePlateTMm", "allowablePressureKPa", "soil",
      "slabDepthMm", "slabEffectiveDepthMm", "fckMpa", "rhoL", "punchingCode", "shoredLevels", "slabSelfWeightKPa", "formworkKPa", "constructionKPa", "cycles",
      "angleDeg", "selfWeightNPerM",
    ];
    const offenders: string[] = [];
    let refusals = 0;
    const send = async (body: unknown) => {
      const res = await everyRole.fetch("/api/v1/calculations", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      const answer = await res.text();
      if (res.status === 422) refusals++;
      expect(res.status).toBeLessThan(500);
      offenders.push(...codeWordsIn(answer).map((m) => `${JSON.stringify(body).slice(0, 80)}: ${m}`));
    };
    await send(null);
    await send({});
    await send({ method: "guesswork" });
    for (const method of ALL_METHOD_IDS) {
      await send({ method });
      for (const v of [...WRONG, 0, Number.MAX_SAFE_INTEGER]) await send({ method, ...Object.fromEntries(FIELDS.map((f) => [f, v])) });
      // Right kinds, wrong together: sections and tables with bad parts, extensions out of range.
      await send({ method, lengthMm: 5000, section: { shape: "chs", dMm: 50, tMm: 30 }, table: [{ lengthMm: 1000 }, { safeLoadN: 5 }], propClass: "D", maxExtensionMm: 3000, minExtensionMm: 4000, loadN: 1000, basePlateBMm: 100, basePlateLMm: 100, slabDepthMm: 200, slabEffectiveDepthMm: 250, fckMpa: 30, outOfPlumbMm: 6000, angleDeg: 60 });
    }
    expect(refusals).toBeGreaterThan(ALL_METHOD_IDS.length * 5);
    expect([...new Set(offenders)]).toEqual([]);
  }, 300_000);
});
