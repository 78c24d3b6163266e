// Who may request, issue and see permits: by role, by site, by organisation, and by delegated scope.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { users } from "@/db/schema";
import { anonymous } from "../support/http";
import { type ApiErr, as, client, L2, makeMember, ORCHARD, permitRow, personWithRole, post, requestLoad, site, zoneId } from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

describe("permit role matrix", () => {
  it("an engineer may request but not issue (403, nothing changes)", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const r = await post<ApiErr>(await as("engineer"), `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(403);
    expect((await permitRow(id)).status).toBe("requested");
    const refuse = await post(await as("engineer"), `/api/v1/permits/${id}/refuse`, { reason: "not mine to refuse" });
    expect(refuse.status).toBe(403);
  });

  it("a designer and a site manager may not request permits (403)", async () => {
    const m = await makeMember();
    for (const who of ["designer@demo.example", "manager@demo.example"]) {
      const r = await post(await client(who), `/api/v1/sites/${wharfId}/permits`, { kind: "load", scope: "members", memberIds: [m.id] });
      expect(r.status, who).toBe(403);
    }
  });

  it("without a session every permit endpoint answers 401", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const anon = anonymous();
    expect((await anon.json(`/api/v1/sites/${wharfId}/permits`)).status).toBe(401);
    expect((await anon.json(`/api/v1/permits/${id}`)).status).toBe(401);
    expect((await post(anon, `/api/v1/permits/${id}/issue`, {})).status).toBe(401);
    expect((await anon.fetch(`/api/v1/permits/${id}/pdf`)).status).toBe(401);
  });

  it("another organisation's admin gets 404 for the permit, its actions, its PDF and the site's permits", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const other = await client("admin@other.example");
    expect((await other.json(`/api/v1/permits/${id}`)).status).toBe(404);
    expect((await post(other, `/api/v1/permits/${id}/issue`, {})).status).toBe(404);
    expect((await post(other, `/api/v1/permits/${id}/refuse`, { reason: "not yours" })).status).toBe(404);
    expect((await other.fetch(`/api/v1/permits/${id}/pdf`)).status).toBe(404);
    expect((await other.json(`/api/v1/sites/${wharfId}/permits`)).status).toBe(404);
    expect((await post(other, `/api/v1/sites/${wharfId}/permits`, { kind: "load", scope: "members", memberIds: [m.id] })).status).toBe(404);
    expect((await other.json(`/api/v1/permits/not-a-uuid`)).status).toBe(404);
  });

  it("a coordinator of another site in the same organisation gets 404 and cannot issue", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const { client: orchardCoordinator } = await personWithRole({ role: "coordinator", siteName: ORCHARD });
    const r = await post(orchardCoordinator, `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(404);
    expect((await permitRow(id)).status).toBe("requested");
  });
});

describe("a supervisor's delegated issuing scope", () => {
  it("403 without scope; allowed within scope (recorded who gave it); 403 outside its zones and after revocation", async () => {
    const sup = await as("supervisor");
    const coord = await as("coordinator");
    const l2 = await zoneId({ siteId: wharfId, name: L2 });
    const l1Member = await makeMember({ zone: "Level 1 slab, bays 1–4" });
    const a = await makeMember();
    const b = await makeMember();
    const first = await requestLoad({ memberIds: [a.id], siteId: wharfId });

    const before = await post<ApiErr>(sup, `/api/v1/permits/${first}/issue`, {});
    expect(before.status).toBe(403);
    expect(before.body.error.message).toContain("issuing scope");

    // Only the coordinator may give scope, only to a supervisor of the site, for the site's zones.
    const byEngineer = await post(await as("engineer"), `/api/v1/sites/${wharfId}/permit-delegations`, { userId: "00000000-0000-4000-8000-000000000000", zoneIds: [l2], validUntil: new Date(Date.now() + 86_400_000).toISOString() });
    expect(byEngineer.status).toBe(403);
    const [eng] = await db.select({ id: users.id }).from(users).where(eq(users.email, "engineer@demo.example"));
    const notSupervisor = await post<ApiErr>(coord, `/api/v1/sites/${wharfId}/permit-delegations`, { userId: eng!.id, zoneIds: [l2], validUntil: new Date(Date.now() + 86_400_000).toISOString() });
    expect(notSupervisor.status).toBe(422);
    expect(notSupervisor.body.error.fields?.userId).toContain("supervisor");

    const [supUser] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, "supervisor@demo.example"));
    const grant = await post<{ delegation: { id: string; grantedBy: string; zoneIds: string[] } }>(coord, `/api/v1/sites/${wharfId}/permit-delegations`, {
      userId: supUser!.id,
      zoneIds: [l2],
      validUntil: new Date(Date.now() + 2 * 86_400_000).toISOString(),
    });
    expect(grant.status).toBe(201);
    const listed = await coord.json<{ delegations: { id: string; userName: string; grantedByName: string; zoneIds: string[] }[] }>(`/api/v1/sites/${wharfId}/permit-delegations`);
    expect(listed.body.delegations.find((d) => d.id === grant.body.delegation.id)).toMatchObject({ userName: supUser!.name, grantedByName: "Priya Natarajan", zoneIds: [l2] });

    try {
      const ok = await post<{ permit: { status: string; approvedBy: string } }>(sup, `/api/v1/permits/${first}/issue`, {});
      expect(ok.status).toBe(200);
      expect(ok.body.permit).toMatchObject({ status: "issued", approvedBy: supUser!.name });

      // A permit with a member in Level 1 is outside the scope.
      const mixed = await requestLoad({ memberIds: [b.id, l1Member.id], siteId: wharfId });
      const outside = await post<ApiErr>(sup, `/api/v1/permits/${mixed}/issue`, {});
      expect(outside.status).toBe(403);
      expect(outside.body.error.message).toContain("does not cover every zone");
    } finally {
      const revoke = await post(coord, `/api/v1/permit-delegations/${grant.body.delegation.id}/revoke`);
      expect(revoke.status).toBe(200);
    }
    const c = await makeMember();
    const after = await requestLoad({ memberIds: [c.id], siteId: wharfId });
    expect((await post(sup, `/api/v1/permits/${after}/issue`, {})).status).toBe(403);
  });
});
