// The register's count of matching members: it comes with the first page (not with later keyset
// pages), and it is right on the very next request after any change to the site's members —
// whichever process or connection made the change — and unchanged by work that was rolled back.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { as, makeRegisterSite, type RegisterSite } from "../support/fixtures";

type Page = { items: { id: string; tag: string }[]; nextCursor: string | null; prevCursor: string | null; total?: number };

let S: RegisterSite;
const url = (qs = "") => `/api/v1/sites/${S.id}/members${qs ? `?${qs}` : ""}`;
const failingNow = () => S.members.filter((m) => m.pass !== true).length;

beforeAll(async () => {
  S = await makeRegisterSite({ members: 180, label: "Count" });
});
afterAll(async () => {
  await S?.drop();
  await sql.end({ timeout: 5 });
});

async function firstPage(qs: string) {
  const r = await (await as("engineer")).json<Page>(url(qs));
  expect(r.status).toBe(200);
  return r.body;
}

describe("GET /api/v1/sites/{siteId}/members: total", () => {
  it("comes with the first page and not with later pages (keep the first page's)", async () => {
    const c = await as("engineer");
    const first = await c.json<Page>(url("limit=50"));
    expect(first.body.total).toBe(180);
    const second = await c.json<Page>(url(`limit=50&cursor=${first.body.nextCursor}`));
    expect(second.status).toBe(200);
    expect(second.body.items).toHaveLength(50);
    expect(second.body).not.toHaveProperty("total");
    // Asking for one row with the same filters is the way to a count without the first page.
    expect((await c.json<Page>(url("limit=1"))).body.total).toBe(180);
  });

  it("counts a change made on another connection at once, and every repeat of an unchanged view agrees", async () => {
    const before = failingNow();
    // The same view asked again and again (a desk polling the register) keeps the same count.
    for (let i = 0; i < 3; i++) expect((await firstPage("pass=false&limit=10")).total).toBe(before);
    const passing = S.members.filter((m) => m.pass === true).slice(0, 3);
    // Another process (the worker, another app instance) marks three members failing.
    await sql`update members set check_pass = false where id in ${sql(passing.map((m) => m.id))}`;
    try {
      expect((await firstPage("pass=false&limit=10")).total).toBe(before + 3);
      expect((await firstPage("limit=10")).total).toBe(180);
    } finally {
      await sql`update members set check_pass = true where id in ${sql(passing.map((m) => m.id))}`;
    }
    expect((await firstPage("pass=false&limit=10")).total).toBe(before);
  });

  it("counts members added and removed at once, and is not moved by a change that was rolled back", async () => {
    expect((await firstPage("q=rt-0&limit=5")).total).toBe(S.members.filter((m) => m.tag.toLowerCase().includes("rt-0")).length);
    const start = (await firstPage("limit=5")).total!;
    const model = S.members[1]!;
    // Rolled back: as if it never happened.
    await sql
      .begin(async (tx) => {
        await tx`insert into members (site_id, tag, member_type_id, extension_mm, load_n)
          values (${S.id}, 'RT-ROLLED-BACK', ${model.typeId}, 2000, 5000)`;
        throw new Error("roll back");
      })
      .catch((e: Error) => expect(e.message).toBe("roll back"));
    expect((await firstPage("limit=5")).total).toBe(start);

    const [added] = await sql<{ id: string }[]>`insert into members (site_id, tag, member_type_id, extension_mm, load_n)
      values (${S.id}, 'RT-ADDED-1', ${model.typeId}, 2000, 5000) returning id`;
    expect((await firstPage("limit=5")).total).toBe(start + 1);
    // A member with no check is not passing: it is counted as failing too.
    expect((await firstPage("pass=false&limit=5")).total).toBe(failingNow() + 1);
    await sql`delete from members where id = ${added!.id}`;
    expect((await firstPage("limit=5")).total).toBe(start);
    expect((await firstPage("pass=false&limit=5")).total).toBe(failingNow());
  });
});
