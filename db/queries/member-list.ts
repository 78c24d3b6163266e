// The register list: filtered, sorted, keyset-paged reads of a site's members (API, CSV export, labels).
import "server-only";
import { and, eq, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, memberTypes, schemes, siteMemberStamps, zones } from "@/db/schema";
import { ValidationError } from "@/lib/errors";
import { MEMBER_STATUSES, type MemberFilters, type MemberSort, type SortDir } from "@/lib/validations/member-list";

/**
 * Each sort is a pair (key, tag): tag is unique per site, so it breaks ties and makes the order
 * total. Every pair has a btree index (site_id, key, tag) so a page is one index range scan.
 * Utilisation sorts on coalesce(utilisation, +∞): a member with no computed capacity is the most
 * worrying one, so it comes first in "highest first" and last in "lowest first".
 */
const SORT_KEYS: Record<MemberSort, { expr: SQL; cast: string }> = {
  tag: { expr: sql`${members.tag}`, cast: "text" },
  utilisation: { expr: sql`coalesce(${members.utilisation}, 'Infinity'::float8)`, cast: "float8" },
  extension: { expr: sql`${members.extensionMm}`, cast: "float8" },
  status: { expr: sql`${members.status}`, cast: "member_status" },
  updated: { expr: sql`${members.updatedAt}`, cast: "timestamptz" },
};

/** What the cursor carries; it is opaque to clients (base64url JSON). */
type CursorPayload = { s: MemberSort; d: SortDir; v: string | number; t: string; b?: 1 };

export function encodeCursor(p: CursorPayload): string {
  return Buffer.from(JSON.stringify(p), "utf8").toString("base64url");
}

function decodeCursor(cursor: string, sort: MemberSort, dir: SortDir): CursorPayload {
  const bad = (reason: string) => new ValidationError({ cursor: reason }, reason);
  let p: unknown;
  try {
    p = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
  } catch {
    throw bad("That cursor is not one this API gave out; start again from the first page.");
  }
  const c = p as Partial<CursorPayload> | null;
  if (!c || typeof c !== "object" || typeof c.t !== "string" || (typeof c.v !== "string" && typeof c.v !== "number"))
    throw bad("That cursor is not one this API gave out; start again from the first page.");
  if (c.s !== sort || c.d !== dir)
    throw bad("That cursor belongs to a different sort order; start again from the first page.");
  // The value is cast in SQL: anything a cast could refuse is refused here first (a 422, not a 500).
  const ok =
    sort === "tag"
      ? typeof c.v === "string"
      : sort === "status"
        ? (MEMBER_STATUSES as readonly unknown[]).includes(c.v)
        : sort === "updated"
          ? typeof c.v === "string" && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}Z$/.test(c.v)
          : (typeof c.v === "number" && Number.isFinite(c.v)) || (sort === "utilisation" && c.v === "Infinity");
  if (!ok || c.t.length > 200) throw bad("That cursor is not one this API gave out; start again from the first page.");
  return c as CursorPayload;
}

/** LIKE pattern with the user's text taken literally. */
function containsPattern(q: string): string {
  return `%${q.toLowerCase().replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}

export function memberFilterConditions(siteId: string, f: MemberFilters): SQL[] {
  const where: SQL[] = [eq(members.siteId, siteId)];
  if (f.status) where.push(eq(members.status, f.status));
  if (f.zoneId) where.push(eq(members.zoneId, f.zoneId));
  if (f.schemeId) where.push(eq(members.schemeId, f.schemeId));
  if (f.typeId) where.push(eq(members.memberTypeId, f.typeId));
  if (f.pass === "true") where.push(eq(members.checkPass, true));
  // A member without a check cannot be said to pass, so "failing" includes it.
  if (f.pass === "false") where.push(sql`${members.checkPass} is not true`);
  if (f.utilMin !== undefined) where.push(gte(members.utilisation, f.utilMin));
  if (f.utilMax !== undefined) where.push(lte(members.utilisation, f.utilMax));
  // lower(tag) LIKE '%…%' is served by the trigram index members_tag_trgm.
  if (f.q) where.push(sql`lower(${members.tag}) like ${containsPattern(f.q)}`);
  return where;
}

const itemColumns = {
  id: members.id,
  tag: members.tag,
  status: members.status,
  zoneId: members.zoneId,
  zoneName: zones.name,
  schemeId: members.schemeId,
  schemeReference: schemes.reference,
  typeId: members.memberTypeId,
  typeName: memberTypes.name,
  typeKind: memberTypes.kind,
  extensionMm: members.extensionMm,
  endConditions: members.endConditions,
  loadN: members.loadN,
  capacityN: members.capacityN,
  utilisation: members.utilisation,
  pass: members.checkPass,
  spacingXMm: members.spacingXMm,
  spacingYMm: members.spacingYMm,
  notes: members.notes,
  updatedAt: members.updatedAt,
  photoCount: sql<number>`(select count(*)::int from photos p where p.member_id = ${members.id} and p.status = 'ready')`,
};

type Row = {
  id: string;
  tag: string;
  status: (typeof members.status.enumValues)[number];
  zoneId: string | null;
  zoneName: string | null;
  schemeId: string | null;
  schemeReference: string | null;
  typeId: string;
  typeName: string;
  typeKind: string;
  extensionMm: number;
  endConditions: string;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  spacingXMm: number | null;
  spacingYMm: number | null;
  notes: string | null;
  updatedAt: Date;
  photoCount: number;
  sortValue: string | number;
};

export type MemberListItem = {
  id: string;
  tag: string;
  status: Row["status"];
  zone: { id: string; name: string } | null;
  scheme: { id: string; reference: string } | null;
  type: { id: string; name: string; kind: string };
  extensionMm: number;
  endConditions: string;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  spacingXMm: number | null;
  spacingYMm: number | null;
  notes: string | null;
  photoCount: number;
  updatedAt: string;
};

function toItem(r: Row): MemberListItem {
  return {
    id: r.id,
    tag: r.tag,
    status: r.status,
    zone: r.zoneId && r.zoneName !== null ? { id: r.zoneId, name: r.zoneName } : null,
    scheme: r.schemeId && r.schemeReference !== null ? { id: r.schemeId, reference: r.schemeReference } : null,
    type: { id: r.typeId, name: r.typeName, kind: r.typeKind },
    extensionMm: r.extensionMm,
    endConditions: r.endConditions,
    loadN: r.loadN,
    capacityN: r.capacityN,
    utilisation: r.utilisation,
    pass: r.pass,
    spacingXMm: r.spacingXMm,
    spacingYMm: r.spacingYMm,
    notes: r.notes,
    photoCount: Number(r.photoCount),
    updatedAt: new Date(r.updatedAt).toISOString(),
  };
}

/** The sort value as the cursor stores it; timestamps as text at full (microsecond) precision. */
function sortValueColumn(sort: MemberSort): SQL<string | number> {
  if (sort === "updated")
    return sql<string>`to_char(${members.updatedAt} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;
  if (sort === "utilisation") return sql<number>`coalesce(${members.utilisation}, 'Infinity'::float8)`;
  return SORT_KEYS[sort].expr as SQL<string | number>;
}

function cursorFromRow(sort: MemberSort, dir: SortDir, r: Row, before?: boolean): string {
  // JSON has no Infinity: members with no utilisation travel as the string "Infinity".
  const v = typeof r.sortValue === "number" && !Number.isFinite(r.sortValue) ? "Infinity" : r.sortValue;
  return encodeCursor({ s: sort, d: dir, v, t: r.tag, ...(before ? { b: 1 as const } : {}) });
}

export type ListMembersArgs = {
  siteId: string;
  filters: MemberFilters;
  sort: MemberSort;
  dir: SortDir;
  limit: number;
  cursor?: string;
  /**
   * Count the matching members. Default: on the first page only (no cursor) — the screen keeps
   * it while paging, and a keyset page never pays for a count. Export and labels say false.
   */
  withTotal?: boolean;
};

export type MemberListPage = {
  items: MemberListItem[];
  nextCursor: string | null;
  prevCursor: string | null;
  /** How many members match the filters: on the first page (no cursor); absent on later pages. */
  total?: number;
};

/**
 * Counts already made, by site and filters, each with the site's member stamp it was counted
 * under (site_member_stamps: renewed when any change to the site's members commits). A count is
 * used only while the stamp read with the page is still that one, so it is never out of date;
 * it saves counting 20,000 rows for every poll of an unchanged register.
 */
const counted = new Map<string, { stamp: string; total: number }>();
const COUNTS_KEPT = 2000;

function filtersKey(siteId: string, f: MemberFilters): string {
  const parts = Object.entries(f)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : 1));
  return `${siteId}|${JSON.stringify(parts)}`;
}

function keepCount(key: string, stamp: string, total: number) {
  counted.delete(key);
  if (counted.size >= COUNTS_KEPT) counted.delete(counted.keys().next().value!);
  counted.set(key, { stamp, total });
}

/** The site's member stamp as text ("none" before its first member), read in the statement it is part of. */
const stampColumn = (siteId: string) =>
  sql<string>`coalesce((select ${siteMemberStamps.stamp}::text from ${siteMemberStamps} where ${siteMemberStamps.siteId} = ${siteId}), 'none')`;

/**
 * One page. A cursor points after a row (next pages) or, with b=1, before it (previous pages);
 * a "before" page is read in reverse order and turned round, so both directions are index scans.
 * One round trip: the rows and the site's member stamp come in one statement; the count is a
 * second statement only when this filter has not been counted under that stamp yet (and never
 * inside a caller's transaction, whose own uncommitted changes others must not see).
 */
export async function listMembers(args: ListMembersArgs, tx: DbOrTx = db): Promise<MemberListPage> {
  return (await readPage(args, tx, false)).page;
}

async function readPage(args: ListMembersArgs, tx: DbOrTx, wantStamp: boolean): Promise<{ page: MemberListPage; stamp?: string }> {
  const { siteId, filters, sort, dir, limit } = args;
  const where = memberFilterConditions(siteId, filters);
  const key = SORT_KEYS[sort];
  const c = args.cursor ? decodeCursor(args.cursor, sort, dir) : null;
  const withTotal = args.withTotal ?? !c;
  const backwards = !!c?.b;
  // Walking forward in "asc" or backward in "desc" both read ascending.
  const ascending = (dir === "asc") !== backwards;
  if (c) {
    const v = sql`${String(c.v)}::${sql.raw(key.cast)}`;
    where.push(
      ascending ? sql`(${key.expr}, ${members.tag}) > (${v}, ${c.t})` : sql`(${key.expr}, ${members.tag}) < (${v}, ${c.t})`,
    );
  }
  const order = ascending ? [sql`${key.expr} asc`, sql`${members.tag} asc`] : [sql`${key.expr} desc`, sql`${members.tag} desc`];
  const useCounts = withTotal && tx === db;
  const readStamp = useCounts || (wantStamp && tx === db);

  const rows = (await tx
    .select({ ...itemColumns, sortValue: sortValueColumn(sort), ...(readStamp ? { stamp: stampColumn(siteId) } : {}) })
    .from(members)
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .leftJoin(zones, eq(zones.id, members.zoneId))
    .leftJoin(schemes, eq(schemes.id, members.schemeId))
    .where(and(...where))
    .orderBy(...order)
    .limit(limit + 1)) as unknown as (Row & { stamp?: string })[];

  const more = rows.length > limit;
  let total: number | undefined;
  if (withTotal) {
    if (!c && !more) {
      // The first page holds every match: that is the count.
      total = rows.length;
    } else {
      const countKey = filtersKey(siteId, filters);
      const kept = useCounts ? counted.get(countKey) : undefined;
      if (kept && rows[0]?.stamp === kept.stamp) total = kept.total;
      else {
        const [r] = await tx
          .select({ n: sql<number>`count(*)::int`, ...(useCounts ? { stamp: stampColumn(siteId) } : {}) })
          .from(members)
          .where(and(...memberFilterConditions(siteId, filters)));
        total = Number(r?.n ?? 0);
        // Kept under the stamp read in the same statement as the count: the two agree.
        if (useCounts && r && "stamp" in r) keepCount(countKey, r.stamp as string, total);
      }
    }
  }

  const page = more ? rows.slice(0, limit) : rows;
  if (backwards) page.reverse();
  const first = page[0];
  const last = page[page.length - 1];
  // Forward: more after this page if we read limit+1; something before it if we came by a cursor.
  // Backward: the reverse.
  const hasNext = backwards ? true : more;
  const hasPrev = backwards ? more : !!c;
  return {
    page: {
      items: page.map(toItem),
      nextCursor: hasNext && last ? cursorFromRow(sort, dir, last) : null,
      prevCursor: hasPrev && first ? cursorFromRow(sort, dir, first, true) : null,
      ...(total !== undefined ? { total } : {}),
    },
    // An empty page has no row to carry the stamp: it is not kept.
    stamp: readStamp ? rows[0]?.stamp : undefined,
  };
}

/**
 * Pages already read, by site, filters, order and position, each with the site's member stamp it
 * was read under (0010 and 0014: renewed when the site's members, or the zone, scheme, type or
 * photos a page shows, change). A kept page is served only after reading the stamp again and
 * finding it unchanged — one small indexed read instead of the page's joins — so a poll of an
 * unchanged register is cheap and a changed one is never served stale. A page is kept as the
 * UTF-8 bytes of its JSON answer: serving it again costs no serialising, and the bytes sit outside
 * the JavaScript heap in about a third of the room the objects took. Bounded by bytes kept.
 */
const keptPages = new Map<string, { stamp: string; body: Uint8Array }>();
const BYTES_KEPT = 16 * 1024 * 1024;
let bytesKept = 0;

function keepPage(key: string, stamp: string, body: Uint8Array) {
  const old = keptPages.get(key);
  if (old) {
    bytesKept -= old.body.byteLength;
    keptPages.delete(key);
  }
  if (body.byteLength > BYTES_KEPT) return;
  while (bytesKept + body.byteLength > BYTES_KEPT && keptPages.size) {
    const [k, v] = keptPages.entries().next().value!;
    keptPages.delete(k);
    bytesKept -= v.body.byteLength;
  }
  keptPages.set(key, { stamp, body });
  bytesKept += body.byteLength;
}

const utf8 = new TextEncoder();

/**
 * listMembers for the register's API, as the JSON answer's bytes: from memory when the site has
 * not changed since the same page was last read, else read (and kept).
 */
export async function listMembersJson(args: Omit<ListMembersArgs, "withTotal">): Promise<Uint8Array> {
  const key = `${filtersKey(args.siteId, args.filters)}|${args.sort}|${args.dir}|${args.limit}|${args.cursor ?? ""}`;
  const hit = keptPages.get(key);
  if (hit) {
    const [r] = await db.select({ stamp: stampColumn(args.siteId) }).from(sql`(select 1) as one`);
    if (r?.stamp === hit.stamp) return hit.body;
  }
  const { page, stamp } = await readPage(args, db, true);
  const body = utf8.encode(JSON.stringify(page));
  if (stamp !== undefined) keepPage(key, stamp, body);
  return body;
}

/** Every matching row in order, a batch at a time (CSV export). */
export async function* iterateMembers(
  args: Omit<ListMembersArgs, "limit" | "cursor" | "withTotal"> & { batchSize?: number },
  tx: DbOrTx = db,
): AsyncGenerator<MemberListItem[]> {
  let cursor: string | undefined;
  for (;;) {
    const page = await listMembers({ ...args, limit: args.batchSize ?? 1000, cursor, withTotal: false }, tx);
    if (page.items.length) yield page.items;
    if (!page.nextCursor) return;
    cursor = page.nextCursor;
  }
}

/** Chosen members of one site by id, in tag order (label sheets); ids from elsewhere are simply not found. */
export async function getMembersByIds({ siteId, ids }: { siteId: string; ids: string[] }, tx: DbOrTx = db) {
  if (ids.length === 0) return [];
  const rows = (await tx
    .select({ ...itemColumns, sortValue: sql<string>`${members.tag}` })
    .from(members)
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .leftJoin(zones, eq(zones.id, members.zoneId))
    .leftJoin(schemes, eq(schemes.id, members.schemeId))
    .where(and(eq(members.siteId, siteId), inArray(members.id, ids)))
    .orderBy(members.tag)) as unknown as Row[];
  return rows.map(toItem);
}

/** Zones, schemes and types used for the register's filter menus. */
export async function getRegisterFilterOptions({ siteId, organisationId }: { siteId: string; organisationId: string }, tx: DbOrTx = db) {
  const [zoneRows, schemeRows, typeRows] = await Promise.all([
    tx.select({ id: zones.id, name: zones.name }).from(zones).where(eq(zones.siteId, siteId)).orderBy(zones.name),
    tx
      .select({ id: schemes.id, reference: schemes.reference, title: schemes.title })
      .from(schemes)
      .where(eq(schemes.siteId, siteId))
      .orderBy(schemes.reference),
    tx
      .select({ id: memberTypes.id, name: memberTypes.name })
      .from(memberTypes)
      .where(eq(memberTypes.organisationId, organisationId))
      .orderBy(memberTypes.name),
  ]);
  return { zones: zoneRows, schemes: schemeRows, types: typeRows };
}
