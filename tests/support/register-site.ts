// A throwaway site in the demo organisation for register list/import tests, so they can count
// and page through members without other tests' members on the demo sites changing the answer.
// Every demo user holds their role on it; drop() removes it and everything on it.
import { randomUUID } from "node:crypto";
import { sql } from "@/db";
import { DEMO_USERS } from "@/db/seed/data";

export type FixtureMember = {
  id: string;
  tag: string;
  status: "draft" | "submitted" | "loaded" | "struck" | "out_of_service";
  zoneId: string | null;
  schemeId: string | null;
  typeId: string;
  extensionMm: number;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  updatedAt: Date;
};

export type RegisterSite = {
  id: string;
  name: string;
  zones: { id: string; name: string }[];
  schemes: { id: string; reference: string }[];
  types: { id: string; name: string }[];
  members: FixtureMember[];
  drop: () => Promise<void>;
};

const STATUSES = ["draft", "submitted", "loaded", "struck", "out_of_service"] as const;

/** Deterministic spread of values (no engine: the list is under test here, not the checks). */
export async function makeRegisterSite({ members: count = 0, label = "List" }: { members?: number; label?: string } = {}): Promise<RegisterSite> {
  const suffix = randomUUID().slice(0, 8);
  const [org] = await sql<{ id: string }[]>`select id from organisations where slug = 'larkfield'`;
  const name = `${label} test site ${suffix}`;
  const [site] = await sql<{ id: string }[]>`
    insert into sites (organisation_id, name, code) values (${org!.id}, ${name}, ${`T-${suffix}`}) returning id`;
  const siteId = site!.id;
  try {
    return await fill();
  } catch (e) {
    // Never leave a half-made site behind for other tests to trip over.
    await sql`delete from sites where id = ${siteId}`;
    throw e;
  }

  async function fill(): Promise<RegisterSite> {
  for (const u of DEMO_USERS) {
    await sql`insert into memberships (user_id, site_id, role)
      select id, ${siteId}, ${u.role} from users where email = ${u.email}`;
  }
  const zones = await sql<{ id: string; name: string }[]>`
    insert into zones (site_id, name, level) values (${siteId}, 'Deck A', 'L1'), (${siteId}, 'Deck B, east', 'L2')
    returning id, name`;
  const schemes = await sql<{ id: string; reference: string }[]>`
    insert into schemes (site_id, reference, title, designer_name, category, design_load_n, design_spacing_x_mm, design_spacing_y_mm, slab_thickness_mm)
    values (${siteId}, ${`TW-T-${suffix}-1`}, 'Deck A propping', 'Test designer', 2, 24000, 1200, 1200, 250),
           (${siteId}, ${`TW-T-${suffix}-2`}, 'Deck B propping', 'Test designer', 1, 20000, 1200, 1200, 200)
    returning id, reference`;
  const types = await sql<{ id: string; name: string }[]>`
    select id, name from member_types where organisation_id = ${org!.id} and archived_at is null order by name`;

  const now = Date.now();
  const rows: FixtureMember[] = [];
  for (let i = 0; i < count; i++) {
    // Some tags carry characters that mean something to LIKE, to prove search takes text literally.
    const tag = i % 97 === 5 ? `RT_${String(i).padStart(4, "0")}` : i % 89 === 7 ? `rt-lower-${String(i).padStart(4, "0")}` : `RT-${String(i).padStart(4, "0")}`;
    const unchecked = i % 41 === 3;
    const capacityN = unchecked ? null : 20000 + ((i * 37) % 50) * 1000;
    const loadN = 4000 + ((i * 53) % 60) * 500;
    // Repeated utilisations (i % 10 === 0 share one value) so ties must be broken by tag.
    const utilisation = capacityN === null ? null : i % 10 === 0 ? 0.5 : loadN / capacityN;
    rows.push({
      id: randomUUID(),
      tag,
      status: STATUSES[i % STATUSES.length]!,
      zoneId: i % 7 === 0 ? null : zones[i % 2]!.id,
      schemeId: i % 5 === 0 ? null : schemes[i % 2]!.id,
      typeId: types[i % types.length]!.id,
      extensionMm: 1800 + ((i * 29) % 40) * 25,
      loadN,
      capacityN,
      utilisation,
      pass: utilisation === null ? false : utilisation <= 1,
      updatedAt: new Date(now - ((i * 7919) % 100000) * 1000),
    });
  }
  for (let i = 0; i < rows.length; i += 500) {
    const batch = rows.slice(i, i + 500).map((m) => ({
      id: m.id,
      site_id: siteId,
      tag: m.tag,
      status: m.status,
      zone_id: m.zoneId,
      scheme_id: m.schemeId,
      member_type_id: m.typeId,
      extension_mm: m.extensionMm,
      load_n: m.loadN,
      capacity_n: m.capacityN,
      utilisation: m.utilisation,
      check_pass: m.pass,
      updated_at: m.updatedAt.toISOString(),
    }));
    await sql`insert into members ${sql(batch)}`;
  }
  return {
    id: siteId,
    name,
    zones,
    schemes,
    types,
    members: rows,
    drop: async () => {
      await sql`delete from sites where id = ${siteId}`;
    },
  };
  }
}
