// Logging and editing members over the API: who may, what is refused (and leaves nothing behind),
// the check stored with each change, and the audit trail.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous } from "../support/http";
import { as, lookups, ORCHARD, ROLES, siteId, uniqueTag, WHARF } from "../support/fixtures";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

type Created = { member: { id: string; tag: string; status: string; loadN: number; checkPass: boolean; latestCheckId: string; zoneName: string | null; memberTypeName: string }; check: { id: string; capacityN: number; utilisation: number; pass: boolean; method: string; basis: string; loadFactor: number; warnings: string[] } };
type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

let site: string;
let L: Awaited<ReturnType<typeof lookups>>;

beforeAll(async () => {
  site = await siteId(WHARF);
  L = await lookups(site);
});

const body = (over: Record<string, unknown> = {}) => ({
  tag: uniqueTag(),
  zoneId: L.zone("Level 2 slab, bays 1–4"),
  schemeId: L.scheme("TW-WXW-014"),
  memberTypeId: L.propD,
  extensionMm: 2600,
  endConditions: "pinned-pinned",
  loadSource: "direct",
  loadN: 8000,
  ...over,
});

async function countTag(tag: string) {
  const [r] = await sql<{ n: number }[]>`select count(*)::int as n from members where tag = ${tag}`;
  return r!.n;
}

describe("POST /api/v1/sites/{siteId}/members", () => {
  it("lets engineers, coordinators and supervisors log a member; other roles get 403, strangers 401/404", async () => {
    for (const role of ROLES) {
      const b = body();
      const r = await (await as(role)).json<Created | ErrorBody>(`/api/v1/sites/${site}/members`, { method: "POST", body: b });
      if (["engineer", "coordinator", "supervisor"].includes(role)) {
        expect(r.status, role).toBe(201);
        expect((r.body as Created).member.tag).toBe(b.tag);
      } else {
        expect(r.status, role).toBe(403);
        expect(await countTag(b.tag)).toBe(0);
      }
    }
    expect((await anonymous().json(`/api/v1/sites/${site}/members`, { method: "POST", body: body() })).status).toBe(401);
    const other = await (await as("other")).json<ErrorBody>(`/api/v1/sites/${site}/members`, { method: "POST", body: body() });
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe("not_found");
  });

  it("returns the member and its check: capacity, utilisation and pass, consistent with the load and factor", async () => {
    const b = body({ loadN: 9000 });
    const r = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: b });
    expect(r.status).toBe(201);
    const { member, check } = r.body;
    expect(member).toMatchObject({ tag: b.tag, status: "draft", loadN: 9000, checkPass: true, zoneName: "Level 2 slab, bays 1–4", latestCheckId: check.id });
    expect(check.capacityN).toBeGreaterThan(0);
    // The utilisation is the compared load over the capacity, on the basis the check states.
    expect(check.utilisation).toBeCloseTo((9000 * check.loadFactor) / check.capacityN, 6);
    expect(check.pass).toBe(true);
    expect(check.method).toBe("en1065");
    expect(check.basis).toBe("safe-working-load");
    const [stored] = await sql<{ n: number; engine_version: string; reason: string }[]>`select count(*) over ()::int as n, engine_version, reason from checks where member_id = ${member.id}`;
    expect(stored).toMatchObject({ n: 1, reason: "logged" });
    expect(stored!.engine_version).toMatch(/\d/);
  });

  it("fails a member whose load is over its capacity, and refuses to submit it", async () => {
    const ok = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body({ loadN: 9000 }) });
    const capacity = ok.body.check.capacityN;
    const failing = body({ loadN: Math.round(capacity * 1.5) });
    const r = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: failing });
    expect(r.status).toBe(201);
    expect(r.body.check.pass).toBe(false);
    expect(r.body.check.utilisation).toBeGreaterThan(1);
    expect(r.body.member.checkPass).toBe(false);

    const submit = body({ loadN: Math.round(capacity * 1.5), submit: true });
    const refused = await (await as("engineer")).json<ErrorBody>(`/api/v1/sites/${site}/members`, { method: "POST", body: submit });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields?.submit).toMatch(/fails its capacity check.*cannot be submitted/);
    expect(await countTag(submit.tag)).toBe(0);

    const passing = body({ submit: true });
    const submitted = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: passing });
    expect(submitted.status).toBe(201);
    expect(submitted.body.member.status).toBe("submitted");
  });

  it("derives the load from the scheme's slab and the as-built spacing", async () => {
    // TW-WXW-014: 250 mm slab. EN 1991-1-1 Table A.1: 24 + 1 + 1 = 26 kN/m³ → 6.5 kN/m²; formwork
    // allowance 0.5 kN/m²; EN 1991-1-6 Table 4.2: 10 % of 6.5 = 0.65 → at least 0.75 kN/m².
    // (6.5 + 0.5 + 0.75) kN/m² × 1.2 m × 1.2 m = 11.16 kN.
    const b = body({ loadSource: "slab", loadN: undefined, spacingXMm: 1200, spacingYMm: 1200 });
    const r = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: b });
    expect(r.status).toBe(201);
    expect(r.body.member.loadN).toBeCloseTo(11160, 6);
    const [c] = await sql<{ inputs: { slabLoad?: { loadPerMemberN: number; steps: unknown[] } } }[]>`select inputs from checks where member_id = ${r.body.member.id}`;
    expect(c!.inputs.slabLoad?.loadPerMemberN).toBeCloseTo(11160, 6);
    expect(c!.inputs.slabLoad?.steps.length).toBeGreaterThan(3);
  });

  it("answers 422 with a reason for each bad field and stores nothing", async () => {
    const engineer = await as("engineer");
    const orchard = await lookups(await siteId(ORCHARD));
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [body({ tag: "" }), "tag", /tag/i],
      [body({ extensionMm: -5 }), "extensionMm", /more than 0/],
      [body({ extensionMm: "2600" }), "extensionMm", /number/],
      [body({ loadN: undefined }), "loadN", /working load/],
      [body({ endConditions: "glued" }), "endConditions", /pinned-pinned/],
      [body({ memberTypeId: "not-a-uuid" }), "memberTypeId", /member type/i],
      [body({ zoneId: orchard.zones[0]!.id }), "zoneId", /not on this site/],
      [body({ extensionMm: 3600 }), "extensionMm", /1980 to 3350 mm/],
      [body({ loadSource: "slab", loadN: undefined, spacingXMm: 1200 }), "spacingYMm", /spacing Y/],
      [body({ loadSource: "slab", loadN: undefined, schemeId: L.scheme("TW-WXW-021"), spacingXMm: 1200, spacingYMm: 1200, extensionMm: 2600 }), "", /./],
      [body({ tag: "WXW-L1-P01" }), "tag", /already on this site's register/],
    ];
    for (const [b, field, reason] of cases) {
      const r = await engineer.json<ErrorBody>(`/api/v1/sites/${site}/members`, { method: "POST", body: b });
      if (field === "") {
        // A scheme that gives a slab (TW-WXW-021 has 900 mm) is accepted: the control case.
        expect(r.status).toBe(201);
        continue;
      }
      expect(r.status, JSON.stringify(b)).toBe(422);
      expect(r.body.error.code).toBe("invalid");
      expect(r.body.error.fields?.[field], `${field} in ${JSON.stringify(r.body)}`).toMatch(reason);
      if (typeof b.tag === "string" && b.tag && b.tag !== "WXW-L1-P01") expect(await countTag(b.tag)).toBe(0);
    }
    const notJson = await engineer.fetch(`/api/v1/sites/${site}/members`, { method: "POST", body: "tag=x", headers: { "content-type": "application/json" } });
    expect(notJson.status).toBe(422);
  });

  it("writes an audit event with the new member and its check in the same transaction", async () => {
    const r = await (await as("supervisor")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body() });
    const rows = await sql<{ action: string; after: { tag: string; check: { id: string; pass: boolean }; source: string } }[]>`
      select action, after from audit_events where entity_type = 'member' and entity_id = ${r.body.member.id}`;
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ action: "member.created", after: { tag: r.body.member.tag, source: "api", check: { id: r.body.check.id, pass: true } } });
  });
});

describe("GET and PATCH /api/v1/members/{memberId}", () => {
  it("lets every role on the site read a member; another organisation and malformed ids get 404", async () => {
    const created = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body() });
    const id = created.body.member.id;
    for (const role of ROLES) {
      const r = await (await as(role)).json<{ member: { id: string }; check: { id: string }; checks: unknown[] }>(`/api/v1/members/${id}`);
      expect(r.status, role).toBe(200);
      expect(r.body.member.id).toBe(id);
      expect(r.body.check.id).toBe(created.body.check.id);
    }
    expect((await (await as("other")).json(`/api/v1/members/${id}`)).status).toBe(404);
    expect((await (await as("other")).json(`/api/v1/members/${id}`, { method: "PATCH", body: { loadN: 1 } })).status).toBe(404);
    expect((await (await as("engineer")).json(`/api/v1/members/nope`)).status).toBe(404);
    expect((await anonymous().json(`/api/v1/members/${id}`)).status).toBe(401);
  });

  it("lets engineers, coordinators and supervisors edit; designers, managers and admins get 403 and nothing changes", async () => {
    const created = await (await as("engineer")).json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body() });
    const id = created.body.member.id;
    for (const role of ROLES) {
      const r = await (await as(role)).json<{ member: { notes: string } }>(`/api/v1/members/${id}`, { method: "PATCH", body: { notes: `note by ${role}` } });
      if (["engineer", "coordinator", "supervisor"].includes(role)) {
        expect(r.status, role).toBe(200);
        expect(r.body.member.notes).toBe(`note by ${role}`);
      } else expect(r.status, role).toBe(403);
    }
    const [m] = await sql<{ notes: string }[]>`select notes from members where id = ${id}`;
    expect(m!.notes).toBe("note by supervisor");
  });

  it("re-checks when the load changes: a failing re-check shows failing everywhere, with before/after in the audit", async () => {
    const engineer = await as("engineer");
    const created = await engineer.json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body({ loadN: 8000 }) });
    const id = created.body.member.id;
    const overload = Math.round(created.body.check.capacityN * 1.3);
    const r = await engineer.json<{ member: { checkPass: boolean; loadN: number; latestCheckId: string }; check: { id: string; pass: boolean; utilisation: number } }>(`/api/v1/members/${id}`, {
      method: "PATCH",
      body: { loadN: overload },
    });
    expect(r.status).toBe(200);
    expect(r.body.check.pass).toBe(false);
    expect(r.body.check.utilisation).toBeGreaterThan(1);
    expect(r.body.member).toMatchObject({ checkPass: false, loadN: overload, latestCheckId: r.body.check.id });
    const read = await (await as("manager")).json<{ member: { checkPass: boolean }; checks: { reason: string; pass: boolean }[] }>(`/api/v1/members/${id}`);
    expect(read.body.member.checkPass).toBe(false);
    expect(read.body.checks.map((c) => [c.reason, c.pass])).toEqual([["edited", false], ["logged", true]]);
    const audit = await sql<{ action: string; before: { loadN: number; checkPass: boolean }; after: { loadN: number; checkPass: boolean } }[]>`
      select action, before, after from audit_events where entity_id = ${id} order by id`;
    expect(audit.map((a) => a.action)).toEqual(["member.created", "member.edited_and_rechecked"]);
    expect(audit[1]).toMatchObject({ before: { loadN: 8000, checkPass: true }, after: { loadN: overload, checkPass: false } });

    // Submitting it now is refused, with the reason.
    const submit = await engineer.json<ErrorBody>(`/api/v1/members/${id}`, { method: "PATCH", body: { status: "submitted" } });
    expect(submit.status).toBe(422);
    expect(submit.body.error.fields?.status).toMatch(/fails its latest capacity check/);
    // Back under capacity: passes again.
    const back = await engineer.json<{ check: { pass: boolean } }>(`/api/v1/members/${id}`, { method: "PATCH", body: { loadN: 8000, extensionMm: 2700 } });
    expect(back.body.check.pass).toBe(true);
  });

  it("does not re-check for a change that cannot alter capacity, and refuses statuses set by permits and unknown fields", async () => {
    const engineer = await as("engineer");
    const created = await engineer.json<Created>(`/api/v1/sites/${site}/members`, { method: "POST", body: body() });
    const id = created.body.member.id;
    const notes = await engineer.json<{ check: null }>(`/api/v1/members/${id}`, { method: "PATCH", body: { notes: "Checked plumb" } });
    expect(notes.status).toBe(200);
    expect(notes.body.check).toBeNull();
    const loaded = await engineer.json<ErrorBody>(`/api/v1/members/${id}`, { method: "PATCH", body: { status: "loaded" } });
    expect(loaded.status).toBe(422);
    expect(loaded.body.error.fields?.status).toMatch(/set by a permit/);
    const unknown = await engineer.json<ErrorBody>(`/api/v1/members/${id}`, { method: "PATCH", body: { capacityN: 1e9 } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields?.capacityN).toMatch(/cannot be changed/);
    const bad = await engineer.json<ErrorBody>(`/api/v1/members/${id}`, { method: "PATCH", body: { extensionMm: 0 } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields?.extensionMm).toMatch(/more than 0/);
    const [row] = await sql<{ n: number }[]>`select count(*)::int as n from checks where member_id = ${id}`;
    expect(row!.n).toBe(1);
  });
});
