// What the server keeps in memory between requests must never be served once it is out of date:
//  - register pages (db/queries/member-list.ts listMembersJson) are kept under the site's member
//    stamp, which a change to the members, or to the zone, scheme, type or photos a page shows,
//    renews — here each change is made on another connection, as another process would;
//  - sign-in answers (db/access-cache.ts) are dropped on every change to people, organisations,
//    sites, roles and signed-out sessions: in this process at once (onboarding-lifecycle.test.ts
//    "a change takes effect on the person's very next request"), and in every other process by
//    the NOTIFY each of those tables sends when a change commits (checked here).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { as, makeRegisterSite, type RegisterSite } from "../support/fixtures";

type Item = { id: string; tag: string; zone: { name: string } | null; scheme: { reference: string } | null; type: { id: string; name: string }; photoCount: number };
type Page = { items: Item[] };

let S: RegisterSite;
beforeAll(async () => {
  S = await makeRegisterSite({ members: 12, label: "Kept" });
});
afterAll(async () => {
  await S?.drop();
  await sql.end({ timeout: 5 });
});

async function page(): Promise<Item[]> {
  const c = await as("coordinator");
  const r = await c.json<Page>(`/api/v1/sites/${S.id}/members?limit=50`);
  expect(r.status).toBe(200);
  return r.body.items;
}

describe("a kept register page is never served after a change it shows", () => {
  it("a zone renamed and a scheme's reference changed show on the very next page", async () => {
    const withZone = S.members.find((m) => m.zoneId === S.zones[0]!.id)!;
    const withScheme = S.members.find((m) => m.schemeId === S.schemes[0]!.id)!;
    // Asked twice: the second answer is the kept one.
    await page();
    expect((await page()).find((i) => i.id === withZone.id)!.zone!.name).toBe(S.zones[0]!.name);
    await sql`update zones set name = 'Deck A (renamed)' where id = ${S.zones[0]!.id}`;
    expect((await page()).find((i) => i.id === withZone.id)!.zone!.name).toBe("Deck A (renamed)");
    await sql`update schemes set reference = ${`${S.schemes[0]!.reference}-rev B`} where id = ${S.schemes[0]!.id}`;
    expect((await page()).find((i) => i.id === withScheme.id)!.scheme!.reference).toBe(`${S.schemes[0]!.reference}-rev B`);
  });

  it("a photo made ready counts at once, and a member type renamed shows at once", async () => {
    const m = S.members[2]!;
    const before = (await page()).find((i) => i.id === m.id)!;
    expect(before.photoCount).toBe(0);
    await sql`insert into photos (site_id, member_id, object_key, status) values (${S.id}, ${m.id}, ${`kept-test/${m.id}.jpg`}, 'ready')`;
    expect((await page()).find((i) => i.id === m.id)!.photoCount).toBe(1);

    // A type of this test's own (a copy of the member's type), so other tests' names are untouched.
    const [t] = await sql<{ id: string }[]>`
      insert into member_types select * from jsonb_populate_record(null::member_types,
        (select to_jsonb(t) || jsonb_build_object('id', gen_random_uuid(), 'name', ${`Kept copy ${S.id.slice(0, 8)}`}::text) from member_types t where id = ${m.typeId}))
      returning id`;
    try {
      await sql`update members set member_type_id = ${t!.id} where id = ${m.id}`;
      expect((await page()).find((i) => i.id === m.id)!.type.name).toBe(`Kept copy ${S.id.slice(0, 8)}`);
      await sql`update member_types set name = ${`Kept copy renamed ${S.id.slice(0, 8)}`} where id = ${t!.id}`;
      expect((await page()).find((i) => i.id === m.id)!.type.name).toBe(`Kept copy renamed ${S.id.slice(0, 8)}`);
    } finally {
      await sql`update members set member_type_id = ${m.typeId} where id = ${m.id}`;
      await sql`delete from member_types where id = ${t!.id}`;
    }
  });
});

describe("every table that decides access tells other processes when a change commits", () => {
  it("users, organisations, sites, memberships and revoked sessions notify on commit, and not on a rollback", async () => {
    const heard: string[] = [];
    const sub = await sql.listen("strutwise_access", (table) => heard.push(table));
    const settle = async (n: number) => {
      // Notifications arrive on their own connection: wait for the count to be reached.
      for (let i = 0; i < 100 && heard.length < n; i++) await new Promise((r) => setTimeout(r, 20));
    };
    try {
      const [u] = await sql<{ id: string }[]>`select id from users where email = 'engineer@demo.example'`;
      await sql`update users set name = name where id = ${u!.id}`;
      await sql`update organisations set name = name where slug = 'larkfield'`;
      await sql`update sites set name = name where id = ${S.id}`;
      await sql`update memberships set role = role where site_id = ${S.id}`;
      await sql`insert into revoked_sessions (sid, user_id, expires_at) values (${`kept-test-${S.id}`}, ${u!.id}, now() + interval '1 hour')`;
      await settle(5);
      expect(heard.slice(0, 5)).toEqual(["users", "organisations", "sites", "memberships", "revoked_sessions"]);

      // Rolled back: nothing is said, so nothing kept is dropped for a change that never happened.
      await sql
        .begin(async (tx) => {
          await tx`update users set name = name where id = ${u!.id}`;
          throw new Error("roll back");
        })
        .catch((e: Error) => expect(e.message).toBe("roll back"));
      await sql`update sites set name = name where id = ${S.id}`;
      await settle(6);
      expect(heard.slice(5)).toEqual(["sites"]);
    } finally {
      await sub.unlisten();
      await sql`delete from revoked_sessions where sid = ${`kept-test-${S.id}`}`;
    }
  });
});
