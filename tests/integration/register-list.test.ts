// The register list API (keyset paging, sort, filters), the CSV export of exactly what the filters
// show, and who may list, export and import — on a throwaway site with 1,100 members.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { sql } from "@/db";
import { anonymous } from "../support/http";
import { as, type FixtureMember, makeRegisterSite, type RegisterSite, ROLES } from "../support/fixtures";

type Item = {
  id: string;
  tag: string;
  status: string;
  zone: { id: string; name: string } | null;
  scheme: { id: string; reference: string } | null;
  type: { id: string; name: string };
  extensionMm: number;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  updatedAt: string;
};
type Page = { items: Item[]; nextCursor: string | null; prevCursor: string | null; total: number };
type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

let S: RegisterSite;
const url = (qs = "") => `/api/v1/sites/${S.id}/members${qs ? `?${qs}` : ""}`;

beforeAll(async () => {
  S = await makeRegisterSite({ members: 1100 });
});
afterAll(async () => {
  await S?.drop();
  await sql.end({ timeout: 5 });
});

const STATUS_ORDER = ["draft", "submitted", "loaded", "struck", "out_of_service"];
/** The order the register promises, written out from its definition (not from the query). */
function expectedOrder(members: FixtureMember[], sort: string, dir: "asc" | "desc") {
  const key = (m: FixtureMember): number | string => {
    switch (sort) {
      case "utilisation":
        return m.utilisation ?? Infinity; // no capacity: the most worrying, first when highest first
      case "extension":
        return m.extensionMm;
      case "status":
        return STATUS_ORDER.indexOf(m.status);
      case "updated":
        return m.updatedAt.getTime();
      default:
        return m.tag;
    }
  };
  // Byte order for tags, as the database's C collation sorts them.
  const cmpTag = (a: string, b: string) => (Buffer.compare(Buffer.from(a), Buffer.from(b)) as number);
  const sorted = [...members].sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    const c = typeof ka === "string" ? cmpTag(ka, kb as string) : ka < (kb as number) ? -1 : ka > (kb as number) ? 1 : 0;
    return c !== 0 ? c : cmpTag(a.tag, b.tag);
  });
  return dir === "asc" ? sorted : sorted.reverse();
}

async function walk(qs: string, limit: number) {
  const c = await as("manager");
  const pages: Page[] = [];
  let cursor: string | null = null;
  do {
    const r: { status: number; body: Page } = await c.json<Page>(url(`${qs}&limit=${limit}${cursor ? `&cursor=${cursor}` : ""}`));
    expect(r.status).toBe(200);
    pages.push(r.body);
    cursor = r.body.nextCursor;
  } while (cursor && pages.length < 1000);
  return pages;
}

describe("GET /api/v1/sites/{siteId}/members: paging and sort", () => {
  for (const sort of ["tag", "utilisation", "extension", "status", "updated"])
    for (const dir of ["asc", "desc"] as const)
      it(`pages through every member exactly once, in ${sort} ${dir} order`, async () => {
        const pages = await walk(`sort=${sort}&dir=${dir}`, 150);
        const ids = pages.flatMap((p) => p.items.map((i) => i.id));
        expect(ids.length).toBe(S.members.length);
        expect(new Set(ids).size).toBe(S.members.length);
        expect(ids).toEqual(expectedOrder(S.members, sort, dir).map((m) => m.id));
        expect(pages[0]!.total).toBe(1100);
        expect(pages[0]!.prevCursor).toBeNull();
        expect(pages.at(-1)!.nextCursor).toBeNull();
      });

  it("walks back with prevCursor to the same pages", async () => {
    const pages = await walk("sort=utilisation&dir=desc", 200);
    const c = await as("manager");
    let cursor = pages.at(-1)!.prevCursor;
    for (let i = pages.length - 2; i >= 0; i--) {
      const r = await c.json<Page>(url(`sort=utilisation&dir=desc&limit=200&cursor=${cursor}`));
      expect(r.body.items.map((x) => x.id)).toEqual(pages[i]!.items.map((x) => x.id));
      cursor = r.body.prevCursor;
    }
    expect(cursor).toBeNull();
  });

  it("defaults to 50 members by tag, and returns the names a screen shows", async () => {
    const r = await (await as("engineer")).json<Page>(url());
    expect(r.status).toBe(200);
    expect(r.body.items).toHaveLength(50);
    const first = expectedOrder(S.members, "tag", "asc")[0]!;
    const item = r.body.items[0]!;
    expect(item.id).toBe(first.id);
    expect(item.type.name).toBe(S.types.find((t) => t.id === first.typeId)!.name);
    expect(item.zone?.name ?? null).toBe(S.zones.find((z) => z.id === first.zoneId)?.name ?? null);
    expect(item.scheme?.reference ?? null).toBe(S.schemes.find((s) => s.id === first.schemeId)?.reference ?? null);
    expect(item).toMatchObject({ tag: first.tag, extensionMm: first.extensionMm, loadN: first.loadN, capacityN: first.capacityN, pass: first.pass });
  });
});

describe("GET /api/v1/sites/{siteId}/members: filters", () => {
  const cases: [string, (m: FixtureMember) => boolean][] = [
    ["status=loaded", (m) => m.status === "loaded"],
    ["pass=false", (m) => m.pass !== true],
    ["pass=true", (m) => m.pass === true],
    ["utilMin=0.5&utilMax=0.9", (m) => m.utilisation !== null && m.utilisation >= 0.5 && m.utilisation <= 0.9],
    ["utilMin=1.0001", (m) => m.utilisation !== null && m.utilisation >= 1.0001],
    ["q=rt-lower", (m) => m.tag.toLowerCase().includes("rt-lower")],
    // "_" is literal, not LIKE's any-character.
    ["q=_", (m) => m.tag.includes("_")],
    ["q=rt-01", (m) => m.tag.toLowerCase().includes("rt-01")],
  ];
  for (const [qs, keep] of cases)
    it(`${qs} returns exactly the matching members`, async () => {
      const pages = await walk(qs, 200);
      const got = pages.flatMap((p) => p.items.map((i) => i.tag)).sort();
      const want = S.members.filter(keep).map((m) => m.tag).sort();
      expect(want.length).toBeGreaterThan(0);
      expect(got).toEqual(want);
      expect(pages[0]!.total).toBe(want.length);
    });

  it("filters by zone, scheme and type, and combines filters", async () => {
    const zone = S.zones[1]!;
    const scheme = S.schemes[0]!;
    const type = S.types[0]!;
    for (const [qs, keep] of [
      [`zoneId=${zone.id}`, (m: FixtureMember) => m.zoneId === zone.id],
      [`schemeId=${scheme.id}`, (m: FixtureMember) => m.schemeId === scheme.id],
      [`typeId=${type.id}`, (m: FixtureMember) => m.typeId === type.id],
      [`zoneId=${zone.id}&status=draft&pass=true`, (m: FixtureMember) => m.zoneId === zone.id && m.status === "draft" && m.pass === true],
    ] as const) {
      const got = (await walk(qs, 200)).flatMap((p) => p.items.map((i) => i.id)).sort();
      const want = S.members.filter(keep).map((m) => m.id).sort();
      expect(want.length, qs).toBeGreaterThan(0);
      expect(got, qs).toEqual(want);
    }
  });

  it("finds nothing (not an error) for a zone of another site", async () => {
    const [other] = await sql<{ id: string }[]>`select id from zones where site_id <> ${S.id} limit 1`;
    const r = await (await as("manager")).json<Page>(url(`zoneId=${other!.id}`));
    expect(r.status).toBe(200);
    expect(r.body.items).toEqual([]);
    expect(r.body.total).toBe(0);
  });
});

describe("GET /api/v1/sites/{siteId}/members: refusals", () => {
  const bad: [string, string, RegExp][] = [
    ["limit=0", "limit", /1 to 200/],
    ["limit=201", "limit", /1 to 200/],
    ["limit=ten", "limit", /whole number/],
    ["sort=weight", "sort", /tag, utilisation, extension, status, updated/],
    ["dir=up", "dir", /asc or desc/],
    ["status=broken", "status", /draft, submitted/],
    ["zoneId=12", "zoneId", /id/],
    ["pass=maybe", "pass", /true.*false/],
    ["utilMin=lots", "utilMin", /number/],
    ["utilMin=0.9&utilMax=0.5", "utilMax", /below the minimum/],
    ["cursor=not-a-cursor", "cursor", /cursor/],
  ];
  for (const [qs, field, reason] of bad)
    it(`${qs} → 422 naming ${field}`, async () => {
      const r = await (await as("manager")).json<ErrorBody>(url(qs));
      expect(r.status).toBe(422);
      expect(r.body.error.code).toBe("invalid");
      expect(r.body.error.fields?.[field]).toMatch(reason);
    });

  it("refuses a forged cursor with 422, never a server error", async () => {
    const forge = (o: object) => Buffer.from(JSON.stringify(o)).toString("base64url");
    for (const [sort, v] of [
      ["extension", "abc"],
      ["status", "exploded"],
      ["updated", "yesterday"],
      ["utilisation", "NaN"],
    ] as const) {
      const r = await (await as("manager")).json<ErrorBody>(url(`sort=${sort}&cursor=${forge({ s: sort, d: "asc", v, t: "RT-0001" })}`));
      expect(r.status, sort).toBe(422);
      expect(r.body.error.fields?.cursor, sort).toMatch(/not one this API gave out/);
    }
  });

  it("refuses a cursor from a different sort order with 422", async () => {
    const first = await (await as("manager")).json<Page>(url("sort=tag&limit=5"));
    const r = await (await as("manager")).json<ErrorBody>(url(`sort=extension&cursor=${first.body.nextCursor}`));
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.cursor).toMatch(/different sort/);
  });

  it("is 401 signed out, 404 for another organisation and for a malformed site id", async () => {
    expect((await anonymous().json(url())).status).toBe(401);
    const other = await (await as("other")).json<ErrorBody>(url());
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe("not_found");
    expect((await (await as("manager")).json(`/api/v1/sites/not-a-site/members`)).status).toBe(404);
    expect((await (await as("other")).json(`/api/v1/sites/${S.id}/members/export.csv`)).status).toBe(404);
    expect((await (await as("other")).json(`/api/v1/sites/${S.id}/labels`, { method: "POST", body: { memberIds: [S.members[0]!.id] } })).status).toBe(404);
  });
});

describe("GET /api/v1/sites/{siteId}/members/export.csv", () => {
  it("exports every member the filters show (not one page), in the sort asked for", async () => {
    const res = await (await as("supervisor")).fetch(`/api/v1/sites/${S.id}/members/export.csv?pass=true&sort=extension&dir=desc&limit=5`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename=".*\.csv"/);
    const parsed = Papa.parse<Record<string, string>>((await res.text()).replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const want = expectedOrder(S.members.filter((m) => m.pass === true), "extension", "desc");
    expect(want.length).toBeGreaterThan(1000); // more than one batch of the stream
    expect(parsed.data.map((r) => r.tag)).toEqual(want.map((m) => m.tag));
    const row = parsed.data[0]!;
    const m = want[0]!;
    expect(row).toMatchObject({
      member_id: m.id,
      check: "pass",
      extension_mm: String(m.extensionMm),
      load_kn: String(m.loadN / 1000),
      type: S.types.find((t) => t.id === m.typeId)!.name,
    });
    expect(Number(row.utilisation_pct)).toBeCloseTo(m.utilisation! * 100, 1);
  });

  it("writes a failing member as fail, and refuses a bad filter with 422", async () => {
    const res = await (await as("manager")).fetch(`/api/v1/sites/${S.id}/members/export.csv?q=RT-0003`);
    const rows = Papa.parse<Record<string, string>>((await res.text()).replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: true }).data;
    const m = S.members.find((x) => x.tag === "RT-0003")!;
    expect(rows.find((r) => r.tag === "RT-0003")).toMatchObject({ check: m.pass ? "pass" : "fail", utilisation_pct: "" });
    const bad = await (await as("manager")).json<ErrorBody>(`/api/v1/sites/${S.id}/members/export.csv?status=nope`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields?.status).toBeTruthy();
  });
});

describe("who may list, export and import", () => {
  it("lets every role on the site list and export; only engineers and coordinators import", async () => {
    // A file with one unreadable row: a role allowed to import gets the report (422), not a 403.
    const csv = "tag,type,extension_mm,load_kn\nRT-ROLE-1,No such type,2500,10\n";
    for (const role of ROLES) {
      const c = await as(role);
      expect((await c.json(url("limit=1"))).status, `${role} list`).toBe(200);
      expect((await c.fetch(`/api/v1/sites/${S.id}/members/export.csv?limit=1`)).status, `${role} export`).toBe(200);
      const imp = await c.fetch(`/api/v1/sites/${S.id}/members/import`, { method: "POST", headers: { "content-type": "text/csv" }, body: csv });
      expect(imp.status, `${role} import`).toBe(["engineer", "coordinator"].includes(role) ? 422 : 403);
    }
    const [n] = await sql<{ n: number }[]>`select count(*)::int as n from members where site_id = ${S.id} and tag like 'RT-ROLE-%'`;
    expect(n!.n).toBe(0);
    expect((await anonymous().fetch(`/api/v1/sites/${S.id}/members/import`, { method: "POST", headers: { "content-type": "text/csv" }, body: csv })).status).toBe(401);
  });
});
