// The member library, schemes and zones over the API: who may change them, what is refused, and
// that editing a type re-checks every member that uses it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous } from "../support/http";
import { as, lookups, ROLES, siteId, uniqueTag } from "../support/fixtures";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
let site: string;
beforeAll(async () => {
  site = await siteId();
});

const tableType = (name: string, loadsKn: number[]) => ({
  kind: "supplier-table",
  name,
  supplier: "Integration test table",
  params: { table: [1500, 2500, 3500].map((lengthMm, i) => ({ lengthMm, safeLoadN: loadsKn[i]! * 1000 })) },
});

describe("member types", () => {
  it("every role on the site can read the library; only designers and admins may add to it", async () => {
    for (const role of ROLES) {
      const r = await (await as(role)).json<{ items: { name: string }[] }>(`/api/v1/sites/${site}/member-types`);
      expect(r.status, role).toBe(200);
      expect(r.body.items.some((t) => t.name.startsWith("EN 1065 class D"))).toBe(true);
      const post = await (await as(role)).json(`/api/v1/sites/${site}/member-types`, { method: "POST", body: tableType(uniqueTag(`T-${role}`), [60, 50, 40]) });
      expect(post.status, role).toBe(["designer", "admin"].includes(role) ? 201 : 403);
    }
    expect((await (await as("other")).json(`/api/v1/sites/${site}/member-types`)).status).toBe(404);
    expect((await anonymous().json(`/api/v1/sites/${site}/member-types`)).status).toBe(401);
  });

  it("refuses bad types with the field and the reason", async () => {
    const designer = await as("designer");
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ kind: "en1065-prop", name: uniqueTag("P"), params: { propClass: "D" }, minExtensionMm: 3000, maxExtensionMm: 2000 }, "minExtensionMm", /less than the maximum/],
      [{ kind: "en1065-prop", name: uniqueTag("P"), params: { propClass: "Z" }, minExtensionMm: 1000, maxExtensionMm: 2000 }, "params.propClass", /A to E/],
      [{ ...tableType(uniqueTag("T"), [60, 50, 40]), params: { table: [{ lengthMm: 2000, safeLoadN: 5000 }, { lengthMm: 1500, safeLoadN: 4000 }] } }, "params.table.1.lengthMm", /must increase/],
      [{ ...tableType(uniqueTag("T"), [60, 50, 40]), params: { table: [{ lengthMm: 2000, safeLoadN: 5000 }] } }, "params.table", /at least two rows/],
      [{ kind: "steel-section", name: uniqueTag("S"), params: { section: { shape: "chs", dMm: 100, tMm: -1 }, grade: "S355", formed: "hot-finished" } }, "params.section.tMm", /more than 0/],
      [{ kind: "steel-section", name: uniqueTag("S"), params: { section: { shape: "chs", dMm: 100, tMm: 5 }, grade: "S999", formed: "hot-finished" } }, "params.grade", /steel grade/],
      [{ kind: "timber-section", name: uniqueTag("W"), params: { section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C99" } }, "params.strengthClass", /strength class/],
      [{ kind: "en1065-prop", name: "EN 1065 class D prop, 1.98–3.35 m", params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3350 }, "name", /already has a type/],
      [{ kind: "mystery", name: "x" }, "kind", /kind of member/],
    ];
    for (const [b, field, reason] of cases) {
      const r = await designer.json<ErrorBody>(`/api/v1/sites/${site}/member-types`, { method: "POST", body: b });
      expect(r.status, JSON.stringify(b)).toBe(422);
      expect(r.body.error.fields?.[field], JSON.stringify(r.body)).toMatch(reason);
    }
  });

  it("editing a type re-checks every member using it, and the audit records how many", async () => {
    const designer = await as("designer");
    const engineer = await as("engineer");
    const created = await designer.json<{ memberType: { id: string } }>(`/api/v1/sites/${site}/member-types`, { method: "POST", body: tableType(uniqueTag("RECHECK"), [60, 50, 40]) });
    expect(created.status).toBe(201);
    const typeId = created.body.memberType.id;
    const L = await lookups(site);
    const ids: string[] = [];
    for (const load of [30000, 35000]) {
      const m = await engineer.json<{ member: { id: string }; check: { pass: boolean; capacityN: number } }>(`/api/v1/sites/${site}/members`, {
        method: "POST",
        body: { tag: uniqueTag("RC"), zoneId: L.zone("Level 3 slab, bays 5–7"), memberTypeId: typeId, extensionMm: 2500, loadN: load },
      });
      expect(m.status).toBe(201);
      // The table reads 50 kN at 2500 mm exactly: a row of the invented table above.
      expect(m.body.check.capacityN).toBeCloseTo(50000, 6);
      expect(m.body.check.pass).toBe(true);
      ids.push(m.body.member.id);
    }
    // The supplier's corrected table gives 32 kN at 2500 mm: the 35 kN member now fails.
    const edited = await designer.json<{ recheckedMembers: number; memberType: { revision: number } }>(`/api/v1/sites/${site}/member-types/${typeId}`, {
      method: "PATCH",
      body: tableType(uniqueTag("RECHECK-2"), [40, 32, 25]),
    });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ recheckedMembers: 2, memberType: { revision: 2 } });
    const a = await engineer.json<{ member: { checkPass: boolean; capacityN: number }; checks: { reason: string }[] }>(`/api/v1/members/${ids[0]}`);
    const b = await engineer.json<{ member: { checkPass: boolean; capacityN: number } }>(`/api/v1/members/${ids[1]}`);
    expect(a.body.member).toMatchObject({ checkPass: true });
    expect(a.body.member.capacityN).toBeCloseTo(32000, 6);
    expect(b.body.member.checkPass).toBe(false);
    expect(a.body.checks[0]!.reason).toBe("type edited (revision 2)");
    const [audit] = await sql<{ after: { recheckedMembers: number } }[]>`select after from audit_events where entity_id = ${typeId} and action = 'member_type.updated'`;
    expect(audit!.after.recheckedMembers).toBe(2);
    const memberAudit = await sql<{ action: string }[]>`select action from audit_events where entity_id = ${ids[1]!} order by id`;
    expect(memberAudit.map((x) => x.action)).toEqual(["member.created", "member.rechecked"]);

    // An engineer cannot edit the library.
    expect((await engineer.json(`/api/v1/sites/${site}/member-types/${typeId}`, { method: "PATCH", body: tableType(uniqueTag("X"), [1, 1, 1]) })).status).toBe(403);
    // In use: it cannot be deleted, and the message says why.
    const del = await designer.json<ErrorBody>(`/api/v1/sites/${site}/member-types/${typeId}`, { method: "DELETE" });
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/used by 2 members.*cannot be deleted/);
    // An unused type can.
    const spare = await designer.json<{ memberType: { id: string } }>(`/api/v1/sites/${site}/member-types`, { method: "POST", body: tableType(uniqueTag("SPARE"), [9, 8, 7]) });
    expect((await designer.json(`/api/v1/sites/${site}/member-types/${spare.body.memberType.id}`, { method: "DELETE" })).status).toBe(200);
    expect((await (await as("other")).json(`/api/v1/sites/${site}/member-types/${typeId}`, { method: "DELETE" })).status).toBe(404);
  });
});

describe("zones and schemes", () => {
  it("zones: everyone reads; designers, coordinators and admins add; bad input is a 422 with the field", async () => {
    for (const role of ROLES) {
      expect((await (await as(role)).json(`/api/v1/sites/${site}/zones`)).status, role).toBe(200);
      const r = await (await as(role)).json(`/api/v1/sites/${site}/zones`, { method: "POST", body: { name: uniqueTag(`Zone ${role}`), level: "L4" } });
      expect(r.status, role).toBe(["designer", "coordinator", "admin"].includes(role) ? 201 : 403);
    }
    const empty = await (await as("coordinator")).json<ErrorBody>(`/api/v1/sites/${site}/zones`, { method: "POST", body: { name: "  " } });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields?.name).toMatch(/name/);
    const dup = await (await as("coordinator")).json<ErrorBody>(`/api/v1/sites/${site}/zones`, { method: "POST", body: { name: "Level 1 slab, bays 1–4" } });
    expect(dup.body.error.fields?.name).toMatch(/already has a zone/);
    expect((await (await as("other")).json(`/api/v1/sites/${site}/zones`)).status).toBe(404);
  });

  it("schemes: everyone reads; designers and coordinators publish; audit written; category and dates checked", async () => {
    for (const role of ROLES) {
      expect((await (await as(role)).json(`/api/v1/sites/${site}/schemes`)).status, role).toBe(200);
      const r = await (await as(role)).json(`/api/v1/sites/${site}/schemes`, {
        method: "POST",
        body: { reference: uniqueTag("TW"), title: "Test scheme", designerName: "A. Designer", category: 2, slabThicknessMm: 200 },
      });
      expect(r.status, role).toBe(["designer", "coordinator"].includes(role) ? 201 : 403);
    }
    const designer = await as("designer");
    const bad = await designer.json<ErrorBody>(`/api/v1/sites/${site}/schemes`, {
      method: "POST",
      body: { reference: uniqueTag("TW"), title: "x", designerName: "y", category: 5, validFrom: "2025-06-01", validUntil: "2025-05-01" },
    });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields?.category).toMatch(/0 to 3/);
    expect(bad.body.error.fields?.validUntil).toMatch(/after valid from/);
    const ok = await designer.json<{ scheme: { id: string } }>(`/api/v1/sites/${site}/schemes`, {
      method: "POST",
      body: { reference: uniqueTag("TW"), title: "Scheme with files", designerName: "A. Designer", category: 1 },
    });
    const [audit] = await sql<{ action: string }[]>`select action from audit_events where entity_id = ${ok.body.scheme.id}`;
    expect(audit!.action).toBe("scheme.created");
    expect((await (await as("other")).json(`/api/v1/sites/${site}/schemes`)).status).toBe(404);

    // Drawing upload: a real PDF header is accepted; text bytes are refused with the reason.
    const files = `/api/v1/sites/${site}/schemes/${ok.body.scheme.id}/files`;
    const pdf = Buffer.from("%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n");
    const start = await designer.json<{ key: string; uploadUrl: string }>(files, { method: "POST", body: { kind: "drawing", contentType: "application/pdf", size: pdf.length } });
    expect(start.status).toBe(200);
    await fetch(start.body.uploadUrl, { method: "PUT", headers: { "content-type": "application/pdf" }, body: pdf });
    const done = await designer.json<{ scheme: { drawingKey: string } }>(`${files}/complete`, { method: "POST", body: { kind: "drawing", key: start.body.key } });
    expect(done.status).toBe(200);
    expect(done.body.scheme.drawingKey).toBe(start.body.key);
    const fake = await designer.json<{ key: string; uploadUrl: string }>(files, { method: "POST", body: { kind: "certificate", contentType: "application/pdf", size: 10 } });
    await fetch(fake.body.uploadUrl, { method: "PUT", headers: { "content-type": "application/pdf" }, body: "not a pdf!" });
    const refused = await designer.json<ErrorBody>(`${files}/complete`, { method: "POST", body: { kind: "certificate", key: fake.body.key } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields?.file).toMatch(/neither a PDF nor/);
    expect((await (await as("engineer")).json(files, { method: "POST", body: { kind: "drawing", contentType: "application/pdf", size: 10 } })).status).toBe(403);
  });
});
