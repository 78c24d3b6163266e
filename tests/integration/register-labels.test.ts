// QR label sheets: the PDF carries the chosen members' tags (read back from the PDF's text), one
// sheet per 21 labels, and refuses empty or foreign choices.
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
  await sql.end({ timeout: 5 });
});

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
    for (const m of chosen) expect(text).toContain(m.tag);
    // Only the chosen ones.
    expect(text).not.toContain(S.members[3]!.tag);
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
    for (const m of want) expect(text).toContain(m.tag);
  });

  it("says so when no member matches", async () => {
    const r = await (await as("manager")).json<{ error: { message: string } }>(`/api/v1/sites/${S.id}/labels?q=nothing-like-this`);
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/No member matches/);
  });
});
