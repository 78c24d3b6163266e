// QR label sheets: the PDF carries the chosen members' tags (read back from the PDF's text), one
// sheet per 21 labels, and refuses empty or foreign choices. Long tags, type and zone names stay
// inside their own label (positions read back from the PDF), and a part-used sheet starts at the
// chosen cell.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { extractText, getDocumentProxy } from "unpdf";
import { sql } from "@/db";
import { as, makeRegisterSite, type RegisterSite } from "../support/fixtures";

let S: RegisterSite;
beforeAll(async () => {
  S = await makeRegisterSite({ members: 60, label: "Labels" });
});
afterAll(async () => {
  await S?.drop();
  if (longTypeId) await sql`delete from member_types where id = ${longTypeId}`;
  await sql.end({ timeout: 5 });
});
let longTypeId: string | undefined;

async function pdfText(res: Response) {
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toBe("application/pdf");
  const bytes = new Uint8Array(await res.arrayBuffer());
  expect(Buffer.from(bytes.slice(0, 5)).toString()).toBe("%PDF-");
  const doc = await getDocumentProxy(bytes);
  const { totalPages, text } = await extractText(doc, { mergePages: true });
  return { pages: totalPages, text };
}

describe("POST /api/v1/sites/{siteId}/labels", () => {
  it("prints a label with the tag, type and zone of each chosen member, and the caution", async () => {
    const chosen = [S.members[1]!, S.members[2]!, S.members[9]!];
    const res = await (await as("supervisor")).fetch(`/api/v1/sites/${S.id}/labels`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ memberIds: chosen.map((m) => m.id) }),
    });
    const { pages, text } = await pdfText(res);
    expect(pages).toBe(1);
    const flat = text.replace(/\s+/g, "");
    for (const m of chosen) expect(flat).toContain(m.tag);
    // Only the chosen ones.
    expect(flat).not.toContain(S.members[3]!.tag);
    const zone = S.zones.find((z) => z.id === chosen[0]!.zoneId)!;
    expect(text.replace(/\s+/g, " ")).toContain(zone.name);
    expect(text.replace(/\s+/g, " ")).toMatch(/competent temporary works designer/);
  });

  it("refuses an empty choice and a member of another site with 422", async () => {
    const c = await as("engineer");
    const empty = await c.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${S.id}/labels`, { method: "POST", body: { memberIds: [] } });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields.memberIds).toMatch(/at least one/);
    const [foreign] = await sql<{ id: string }[]>`select id from members where site_id <> ${S.id} limit 1`;
    const r = await c.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${S.id}/labels`, {
      method: "POST",
      body: { memberIds: [S.members[0]!.id, foreign!.id] },
    });
    expect(r.status).toBe(422);
    expect(r.body.error.fields.memberIds).toMatch(/not on this site/);
  });
});

describe("GET /api/v1/sites/{siteId}/labels (the register's filters)", () => {
  it("prints every member the filters show, 21 to a sheet", async () => {
    const res = await (await as("manager")).fetch(`/api/v1/sites/${S.id}/labels?pass=true`);
    const want = S.members.filter((m) => m.pass === true);
    expect(want.length).toBeGreaterThan(42);
    const { pages, text } = await pdfText(res);
    expect(pages).toBe(Math.ceil(want.length / 21));
    // A longer tag may take two lines on its label (it breaks after its own "-", nothing is cut).
    const flat = text.replace(/\s+/g, "");
    for (const m of want) expect(flat).toContain(m.tag);
  });

  it("says so when no member matches", async () => {
    const r = await (await as("manager")).json<{ error: { message: string } }>(`/api/v1/sites/${S.id}/labels?q=nothing-like-this`);
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/No member matches/);
  });
});

// ── where the text lands ────────────────────────────────────────────────────────────────────────
// The sheet is the common 21-up A4 layout: labels 63.5 × 38.1 mm, 3 across at a 66.04 mm pitch and
// 7 down at 38.1 mm, first label 7.21 mm from the left edge and 15.15 mm from the top (common
// practice; value to be confirmed against the label supplier's template). Written out here, not
// imported, so a change to the sheet's geometry in lib/pdf/labels.tsx fails this test.
const PT = 72 / 25.4;
const CELL = { w: 63.5 * PT, h: 38.1 * PT, pitchX: 66.04 * PT, pitchY: 38.1 * PT, left: 7.21 * PT, top: 15.15 * PT };
const cellBox = (n: number) => {
  const i = n - 1;
  const left = CELL.left + (i % 3) * CELL.pitchX;
  const top = CELL.top + Math.floor(i / 3) * CELL.pitchY;
  return { left, right: left + CELL.w, top, bottom: top + CELL.h };
};
const GRID_BOTTOM = CELL.top + 7 * CELL.pitchY;

type Item = { str: string; x: number; width: number; baseline: number; height: number };
type Sheet = { cells: Map<number, Item[]>; footer: string; stray: Item[] };

/** Each page's text items (pdf.js: transform[4], transform[5] = the baseline's start, from the bottom) sorted into the cell they start in. */
async function sheets(res: Response): Promise<Sheet[]> {
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toBe("application/pdf");
  const doc = await getDocumentProxy(new Uint8Array(await res.arrayBuffer()));
  const out: Sheet[] = [];
  for (let p = 1; p <= doc.numPages; p++) {
    const page = await doc.getPage(p);
    const pageH = page.getViewport({ scale: 1 }).height;
    const sheet: Sheet = { cells: new Map(), footer: "", stray: [] };
    for (const raw of (await page.getTextContent()).items) {
      if (!("str" in raw) || raw.str.trim() === "") continue;
      const it: Item = { str: raw.str, x: raw.transform[4], width: raw.width, baseline: pageH - raw.transform[5], height: raw.height };
      if (it.baseline > GRID_BOTTOM) {
        sheet.footer += `${it.str} `;
        continue;
      }
      let n = 0;
      for (let c = 1; c <= 21 && !n; c++) {
        const b = cellBox(c);
        if (it.x >= b.left && it.x <= b.right && it.baseline >= b.top && it.baseline <= b.bottom) n = c;
      }
      if (n) sheet.cells.set(n, [...(sheet.cells.get(n) ?? []), it]);
      else sheet.stray.push(it);
    }
    out.push(sheet);
  }
  return out;
}

/** Every item of a cell ends before the label's right edge, and its glyphs stay below its top and above its bottom. */
function expectInside(sheet: Sheet, n: number) {
  const b = cellBox(n);
  for (const it of sheet.cells.get(n) ?? []) {
    expect(it.x + it.width, `"${it.str}" in cell ${n} runs past the label's right edge`).toBeLessThanOrEqual(b.right);
    expect(it.baseline - it.height, `"${it.str}" in cell ${n} rises above the label`).toBeGreaterThanOrEqual(b.top);
    expect(it.baseline + 0.25 * it.height, `"${it.str}" in cell ${n} hangs below the label`).toBeLessThanOrEqual(b.bottom);
  }
}
const cellText = (sheet: Sheet, n: number) => (sheet.cells.get(n) ?? []).map((i) => i.str).join("");

describe("long tags, types and zones stay on their own label", () => {
  const LONG_TYPE = "Raking shore, steel, adjustable, supplier range 4.20–6.80 m with heavy-duty inner tube, twin base plates and kicker brackets";
  const LONG_ZONE = "Level 2 grid lines C–D / 4–6, north core wall and the loading bay under the tower crane, temporary works area B";
  // Tags in the order the sheet prints them (by tag): long ones with separators, one with none,
  // one with spaces, and a short one between them.
  const TAGS = ["WXW-L2-GRID-C4-RAKER-012", "WXW-L2-GRID-C4-RAKER-013", "WXWL2GRIDC4RAKER014NOSEPARATORS", "WXW L2 GRID C5 RAKER 015 EAST FACE", "WXW-P1"];
  let ids: string[] = [];

  beforeAll(async () => {
    const [org] = await sql<{ id: string }[]>`select organisation_id as id from sites where id = ${S.id}`;
    // Archived, so it never shows in another test's type list.
    const [type] = await sql<{ id: string }[]>`
      insert into member_types (organisation_id, name, kind, params, archived_at)
      values (${org!.id}, ${`${LONG_TYPE} ${randomUUID().slice(0, 6)}`.slice(0, 120)}, 'en1065-prop', '{}'::jsonb, now()) returning id`;
    longTypeId = type!.id;
    const [zone] = await sql<{ id: string }[]>`insert into zones (site_id, name, level) values (${S.id}, ${LONG_ZONE}, 'L2') returning id`;
    const rows = await sql<{ id: string; tag: string }[]>`
      insert into members ${sql(
        TAGS.map((tag) => ({ site_id: S.id, tag, status: "draft", zone_id: zone!.id, member_type_id: longTypeId!, extension_mm: 2400, load_n: 10000 })),
      )} returning id, tag`;
    ids = TAGS.map((t) => rows.find((r) => r.tag === t)!.id);
  });

  it("on the chosen members' sheet, every text item of every label lies inside its own 63.5 × 38.1 mm cell", async () => {
    // The long ones among 15 ordinary labels: 20 cells, every column and row but the last.
    const chosen = [...ids, ...S.members.slice(0, 15).map((m) => m.id)];
    const res = await (await as("supervisor")).fetch(`/api/v1/sites/${S.id}/labels`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ memberIds: chosen }),
    });
    const [sheet, ...more] = await sheets(res);
    expect(more).toHaveLength(0);
    expect(sheet!.stray.map((i) => i.str)).toEqual([]);
    expect(sheet!.cells.size).toBe(20);
    for (let n = 1; n <= 20; n++) expectInside(sheet!, n);
    // Labels print in tag order, one per cell from cell 1.
    const order = [...S.members.slice(0, 15).map((m) => m.tag), ...TAGS].sort();
    order.forEach((tag, i) => {
      const text = cellText(sheet!, i + 1);
      // The tag is whole (a line may end after its own - but nothing is cut or hyphenated).
      expect(text.replace(/\s+/g, ""), `cell ${i + 1}`).toContain(tag.replace(/\s+/g, ""));
    });
    // Long type and zone names are cut short with an ellipsis, inside the label.
    const long = order.indexOf(TAGS[0]!) + 1;
    expect(cellText(sheet!, long)).toMatch(/^.*Raking shore.*…/);
    expect(cellText(sheet!, long)).toMatch(/Level 2 grid lines.*…/);
    expect(sheet!.footer).toMatch(/competent temporary works designer/);
  });

  it("start: 5 leaves cells 1–4 of the first sheet empty and prints the first label in cell 5", async () => {
    const res = await (await as("supervisor")).fetch(`/api/v1/sites/${S.id}/labels`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ memberIds: ids, start: 5 }),
    });
    const [sheet, ...more] = await sheets(res);
    expect(more).toHaveLength(0);
    for (const n of [1, 2, 3, 4]) expect(sheet!.cells.has(n), `cell ${n} is empty`).toBe(false);
    const sorted = [...TAGS].sort();
    sorted.forEach((tag, i) => {
      expect(cellText(sheet!, 5 + i).replace(/\s+/g, "")).toContain(tag.replace(/\s+/g, ""));
      expectInside(sheet!, 5 + i);
    });
    expect(sheet!.stray).toEqual([]);
  });

  it("the register's filters with ?start=20 fill the last two cells, then a second sheet from its first cell", async () => {
    const res = await (await as("manager")).fetch(`/api/v1/sites/${S.id}/labels?q=wxw&start=20`);
    const [first, second, ...more] = await sheets(res);
    expect(more).toHaveLength(0);
    expect([...first!.cells.keys()]).toEqual([20, 21]);
    expect([...second!.cells.keys()]).toEqual([1, 2, 3]);
    const sorted = [...TAGS].sort();
    expect(cellText(first!, 20).replace(/\s+/g, "")).toContain(sorted[0]!.replace(/\s+/g, ""));
    expect(cellText(second!, 3).replace(/\s+/g, "")).toContain(sorted[4]!.replace(/\s+/g, ""));
    for (const n of [20, 21]) expectInside(first!, n);
    for (const n of [1, 2, 3]) expectInside(second!, n);
  });

  it("refuses a start that is not a whole number from 1 to 21 with 422 naming start, on POST and GET", async () => {
    const c = await as("engineer");
    for (const start of [0, 22, 2.5, -1, "5", null, "two"]) {
      const r = await c.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${S.id}/labels`, { method: "POST", body: { memberIds: ids, start } });
      if (start === "5") {
        // A number given as text in JSON is read as that number.
        expect(r.status).toBe(200);
        continue;
      }
      expect(r.status, `start ${JSON.stringify(start)}`).toBe(422);
      expect(r.body.error.fields.start).toMatch(/whole number from 1 to 21/);
    }
    for (const start of ["0", "22", "2.5", "x", "1e1"]) {
      const r = await c.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${S.id}/labels?q=wxw&start=${start}`);
      expect(r.status, `?start=${start}`).toBe(422);
      expect(r.body.error.fields.start).toMatch(/whole number from 1 to 21/);
    }
    // A bad filter and a bad start are both named.
    const both = await c.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${S.id}/labels?pass=maybe&start=0`);
    expect(both.status).toBe(422);
    expect(Object.keys(both.body.error.fields).sort()).toEqual(["pass", "start"]);
  });
});
