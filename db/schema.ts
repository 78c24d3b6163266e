// The single source of truth for tables, enums and relations.
import { relations, sql } from "drizzle-orm";
import {
  bigint, bigserial, boolean, check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text,
  timestamp, uniqueIndex, uuid,
} from "drizzle-orm/pg-core";

const id = () => uuid("id").primaryKey().defaultRandom();
const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

// ------------------------------------------------------------------ enums
export const siteRole = pgEnum("site_role", ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"]);
export const designCode = pgEnum("design_code", ["en1993", "aisc360-lrfd", "aisc360-asd"]);
export const unitSystem = pgEnum("unit_system", ["si", "us"]);
export const memberTypeKind = pgEnum("member_type_kind", [
  "en1065-prop", "supplier-table", "steel-section", "timber-section", "trench-strut",
]);
export const memberStatus = pgEnum("member_status", ["draft", "submitted", "loaded", "struck", "out_of_service"]);
export const endCondition = pgEnum("end_condition", [
  "pinned-pinned", "fixed-pinned", "fixed-fixed", "fixed-free", "fixed-sway", "pinned-sway",
]);
export const loadSource = pgEnum("load_source", ["direct", "slab", "backprop"]);
export const photoStatus = pgEnum("photo_status", ["pending", "ready", "rejected"]);
export const inspectionResult = pgEnum("inspection_result", ["pass", "fail"]);
export const permitKind = pgEnum("permit_kind", ["load", "strike"]);
export const permitStatus = pgEnum("permit_status", ["requested", "issued", "refused", "expired", "withdrawn", "closed"]);
export const schemeDocumentKind = pgEnum("scheme_document_kind", ["drawing", "certificate"]);
export const outboxStatus = pgEnum("outbox_status", ["queued", "sending", "sent", "failed"]);
export const alertDelivery = pgEnum("alert_delivery", ["immediate", "digest", "in_app"]);

// ------------------------------------------------------- people and sites
export const organisations = pgTable("organisations", {
  id: id(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  createdAt: createdAt(),
});

export const users = pgTable(
  "users",
  {
    id: id(),
    organisationId: uuid("organisation_id").notNull().references(() => organisations.id),
    email: text("email").notNull(),
    name: text("name").notNull(),
    phone: text("phone"),
    passwordHash: text("password_hash").notNull(),
    /** Organisation admin: manages people, sites and the member library across the organisation. */
    isOrgAdmin: boolean("is_org_admin").notNull().default(false),
    disabledAt: timestamp("disabled_at", { withTimezone: true }),
    /** Bumped when a person is deactivated or their password is reset: every older session ends. */
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(sql`lower(${t.email})`)],
);

/** Failed sign-ins per e-mail address (known or not), used to slow down guessing. */
export const signInThrottle = pgTable("sign_in_throttle", {
  email: text("email").primaryKey(),
  failures: integer("failures").notNull().default(0),
  lastFailureAt: timestamp("last_failure_at", { withTimezone: true }).notNull().defaultNow(),
  blockedUntil: timestamp("blocked_until", { withTimezone: true }),
});

/**
 * Sessions ended by signing out. A session is a signed cookie with an id (`sid`); signing out
 * records the id here until the cookie would have expired anyway, and every request checks it in
 * the same query that reads the person (primary-key lookup).
 */
export const revokedSessions = pgTable(
  "revoked_sessions",
  {
    sid: text("sid").primaryKey(),
    userId: uuid("user_id").references(() => users.id, { onDelete: "cascade" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  },
  (t) => [index("revoked_sessions_expiry").on(t.expiresAt)],
);

export const sites = pgTable("sites", {
  id: id(),
  organisationId: uuid("organisation_id").notNull().references(() => organisations.id),
  name: text("name").notNull(),
  code: text("code").notNull(),
  address: text("address"),
  timezone: text("timezone").notNull().default("Europe/London"),
  unitSystem: unitSystem("unit_system").notNull().default("si"),
  designCode: designCode("design_code").notNull().default("en1993"),
  permitValidityHours: integer("permit_validity_hours").notNull().default(168),
  inspectionIntervalDays: integer("inspection_interval_days").notNull().default(7),
  plumbToleranceMm: doublePrecision("plumb_tolerance_mm").notNull().default(10),
  expiryWarningHours: integer("expiry_warning_hours").notNull().default(24),
  /** Last permit number issued on this site; bumped under a row lock so numbers have no gaps. */
  permitCounter: integer("permit_counter").notNull().default(0),
  /** Last permit request number given on this site (requests of both kinds); only ever goes up. */
  requestCounter: integer("request_counter").notNull().default(0),
  /** An archived site is read-only and hidden from lists by default; its data is kept. */
  archivedAt: timestamp("archived_at", { withTimezone: true }),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  "memberships",
  {
    id: id(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    role: siteRole("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("memberships_unique").on(t.userId, t.siteId, t.role), index("memberships_site").on(t.siteId)],
);

export const invitations = pgTable("invitations", {
  id: id(),
  organisationId: uuid("organisation_id").notNull().references(() => organisations.id),
  email: text("email").notNull(),
  siteId: uuid("site_id").references(() => sites.id, { onDelete: "cascade" }),
  role: siteRole("role"),
  /** The name the admin typed for the invitee, offered on the acceptance form. */
  name: text("name"),
  /** Every role the invitee gains on the site when they accept. */
  roles: siteRole("roles").array().notNull().default(sql`'{}'::site_role[]`),
  /** SHA-256 of the token in the link; the token itself is only ever in the e-mail. */
  tokenHash: text("token_hash").notNull().unique(),
  invitedBy: uuid("invited_by").references(() => users.id),
  expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  acceptedAt: timestamp("accepted_at", { withTimezone: true }),
  acceptedBy: uuid("accepted_by").references(() => users.id),
  revokedAt: timestamp("revoked_at", { withTimezone: true }),
  lastSentAt: timestamp("last_sent_at", { withTimezone: true }),
  sendCount: integer("send_count").notNull().default(1),
  createdAt: createdAt(),
});

/** Single-use links to set a new password (1 hour); only the token's SHA-256 is kept. */
export const passwordResets = pgTable(
  "password_resets",
  {
    id: id(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index("password_resets_user").on(t.userId)],
);

// ------------------------------------------------------ design and library
export type PlanScale = { x1: number; y1: number; x2: number; y2: number; distanceMm: number };

export const zones = pgTable(
  "zones",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    level: text("level"),
    grid: text("grid"),
    area: text("area"),
    /** The zone's plan as shown and printed (PNG or JPEG, at most 4000 px a side; a PDF upload is rendered to PNG). */
    planImageKey: text("plan_image_key"),
    /** The file as uploaded, kept for the record. */
    planSourceKey: text("plan_source_key"),
    /** What the upload was, read from its bytes: image/png, image/jpeg, image/webp or application/pdf. */
    planSourceType: text("plan_source_type"),
    planWidth: integer("plan_width"),
    planHeight: integer("plan_height"),
    /** Two points on the plan (fractions 0–1 of the image) and the real distance between them. */
    planScale: jsonb("plan_scale").$type<PlanScale>(),
    planUploadedBy: uuid("plan_uploaded_by").references(() => users.id),
    planUploadedAt: timestamp("plan_uploaded_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("zones_site_name").on(t.siteId, t.name)],
);

/** A scheme's back-propping inputs (validated by schemeBackpropSchema). */
export type SchemeBackprop = { shoredLevels: number; formworkKPa?: number; constructionKPa?: number; cycles?: number };

export const schemes = pgTable(
  "schemes",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    reference: text("reference").notNull(),
    title: text("title").notNull(),
    designerName: text("designer_name").notNull(),
    designerUserId: uuid("designer_user_id").references(() => users.id),
    /** Design check category 0–3 (BS 5975:2019 §17.4). */
    category: integer("category").notNull(),
    designLoadN: doublePrecision("design_load_n"),
    designSpacingXMm: doublePrecision("design_spacing_x_mm"),
    designSpacingYMm: doublePrecision("design_spacing_y_mm"),
    /** The slab the members carry, for deriving load per member from as-built spacing. */
    slabThicknessMm: doublePrecision("slab_thickness_mm"),
    concreteDensityKnM3: doublePrecision("concrete_density_kn_m3"),
    formworkKnM2: doublePrecision("formwork_kn_m2"),
    constructionKnM2: doublePrecision("construction_kn_m2"),
    /**
     * Back-propping through the casting cycle (Grundy & Kabaila 1963): levels of props in use at
     * once and the loads at casting, kN/m². The slab's self-weight is the scheme's own slab.
     */
    backprop: jsonb("backprop").$type<SchemeBackprop>(),
    validFrom: timestamp("valid_from", { withTimezone: true }),
    validUntil: timestamp("valid_until", { withTimezone: true }),
    drawingKey: text("drawing_key"),
    certificateKey: text("certificate_key"),
    createdBy: uuid("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("schemes_site_reference").on(t.siteId, t.reference)],
);

export const memberTypes = pgTable(
  "member_types",
  {
    id: id(),
    organisationId: uuid("organisation_id").notNull().references(() => organisations.id),
    name: text("name").notNull(),
    kind: memberTypeKind("kind").notNull(),
    supplier: text("supplier"),
    /** Engine inputs that belong to the type (section, grade, class, range, table…). */
    params: jsonb("params").$type<Record<string, unknown>>().notNull(),
    minExtensionMm: doublePrecision("min_extension_mm"),
    maxExtensionMm: doublePrecision("max_extension_mm"),
    notes: text("notes"),
    revision: integer("revision").notNull().default(1),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("member_types_org_name").on(t.organisationId, t.name)],
);

// ------------------------------------------------------------- the register
/** A member's base, as the engine's base-bearing inputs (validated by memberBaseSchema). */
export type MemberBase = {
  basePlateBMm: number;
  basePlateLMm: number;
  solePlateBMm?: number;
  solePlateLMm?: number;
  solePlateTMm?: number;
  allowablePressureKPa?: number;
  soil?: "soft-clay" | "firm-clay" | "stiff-clay" | "loose-sand" | "medium-sand" | "dense-gravel" | "hardcore";
  slabDepthMm?: number;
  slabEffectiveDepthMm?: number;
  fckMpa?: number;
  rhoL?: number;
  punchingCode?: "en1992" | "aci318";
};

export const members = pgTable(
  "members",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    schemeId: uuid("scheme_id").references(() => schemes.id),
    zoneId: uuid("zone_id").references(() => zones.id),
    memberTypeId: uuid("member_type_id").notNull().references(() => memberTypes.id),
    extensionMm: doublePrecision("extension_mm").notNull(),
    endConditions: endCondition("end_conditions").notNull().default("pinned-pinned"),
    spacingXMm: doublePrecision("spacing_x_mm"),
    spacingYMm: doublePrecision("spacing_y_mm"),
    loadSource: loadSource("load_source").notNull().default("direct"),
    /**
     * Level of props a back-propped member stands at, counted down from the slab being cast:
     * 1 = the props right under it, 2 = the level below… (load source "backprop" only).
     */
    level: integer("level"),
    /** Working (unfactored) load the member carries. */
    loadN: doublePrecision("load_n").notNull(),
    status: memberStatus("status").notNull().default("draft"),
    /** Denormalised from the latest check so the register can filter and sort on 20,000 rows. */
    latestCheckId: uuid("latest_check_id"),
    capacityN: doublePrecision("capacity_n"),
    utilisation: doublePrecision("utilisation"),
    checkPass: boolean("check_pass"),
    /** Where the member stands on its zone's plan, as fractions 0–1 of the image (both or neither). */
    planX: doublePrecision("plan_x"),
    planY: doublePrecision("plan_y"),
    notes: text("notes"),
    /**
     * Lean from vertical (degrees) read at the latest inspection that recorded a plumb reading;
     * the member is checked out of plumb at this angle until a later reading replaces it.
     */
    outOfPlumbDeg: doublePrecision("out_of_plumb_deg"),
    /**
     * What the member stands on (base plate, sole plate, ground or slab; SI: mm, kPa, MPa): when
     * given, bearing under the base is checked with the member (lib/register/run-check.ts).
     */
    base: jsonb("base").$type<MemberBase>(),
    installedBy: uuid("installed_by").references(() => users.id),
    installedAt: timestamp("installed_at", { withTimezone: true }),
    createdBy: uuid("created_by").references(() => users.id),
    /** UUID made on the phone for this create: a retried request returns this member instead of a second one. */
    clientId: uuid("client_id"),
    /** Bumped on every update, so an edit made against an older copy is refused rather than overwriting. */
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("members_site_tag").on(t.siteId, t.tag),
    uniqueIndex("members_site_client").on(t.siteId, t.clientId),
    index("members_site_created").on(t.siteId, t.createdAt, t.id),
    index("members_site_status").on(t.siteId, t.status, t.tag),
    index("members_site_zone").on(t.siteId, t.zoneId, t.tag),
    index("members_site_util").on(t.siteId, t.utilisation, t.id),
    index("members_type").on(t.memberTypeId),
    // Register sorts: each is (key, tag) after the site so a keyset page is one index range scan
    // (db/queries/member-list.ts). Tag search uses the trigram index in migration members_tag_trgm.
    index("members_site_ext_tag").on(t.siteId, t.extensionMm, t.tag),
    index("members_site_updated_tag").on(t.siteId, t.updatedAt, t.tag),
    index("members_site_util_tag").on(t.siteId, sql`coalesce(${t.utilisation}, 'Infinity'::float8)`, t.tag),
    check(
      "members_plan_position",
      sql`(${t.planX} is null and ${t.planY} is null) or (${t.planX} between 0 and 1 and ${t.planY} between 0 and 1)`,
    ),
    // "Failing" (check_pass is not true) is the register's most used filter and a few per cent of
    // a site: the same sorts over just those rows, so a failing page does not walk past the passing ones.
    index("members_site_failing_tag").on(t.siteId, t.tag).where(sql`${t.checkPass} is not true`),
    index("members_site_failing_ext_tag").on(t.siteId, t.extensionMm, t.tag).where(sql`${t.checkPass} is not true`),
    index("members_site_failing_updated_tag").on(t.siteId, t.updatedAt, t.tag).where(sql`${t.checkPass} is not true`),
    index("members_site_failing_status_tag").on(t.siteId, t.status, t.tag).where(sql`${t.checkPass} is not true`),
    index("members_site_failing_util_tag")
      .on(t.siteId, sql`coalesce(${t.utilisation}, 'Infinity'::float8)`, t.tag)
      .where(sql`${t.checkPass} is not true`),
  ],
);

/**
 * One row per site, its stamp renewed by trigger (migration members_change_stamp) when a
 * transaction that inserted, changed or deleted any of the site's members commits. The list keeps
 * each filter's count only while the stamp is unchanged (db/queries/member-list.ts). No foreign
 * key: the trigger runs while a site's members are removed with it.
 */
export const siteMemberStamps = pgTable("site_member_stamps", {
  siteId: uuid("site_id").primaryKey(),
  stamp: bigint("stamp", { mode: "number" }).notNull().default(0),
});

export const checks = pgTable(
  "checks",
  {
    id: id(),
    memberId: uuid("member_id").notNull().references(() => members.id, { onDelete: "cascade" }),
    method: text("method").notNull(),
    reason: text("reason").notNull(),
    inputs: jsonb("inputs").$type<Record<string, unknown>>().notNull(),
    result: jsonb("result").$type<Record<string, unknown>>().notNull(),
    capacityN: doublePrecision("capacity_n"),
    utilisation: doublePrecision("utilisation"),
    pass: boolean("pass").notNull(),
    engineVersion: text("engine_version").notNull(),
    createdBy: uuid("created_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("checks_member").on(t.memberId, t.createdAt)],
);

export const photos = pgTable(
  "photos",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    memberId: uuid("member_id").references(() => members.id, { onDelete: "set null" }),
    inspectionId: uuid("inspection_id"),
    uploadedBy: uuid("uploaded_by").references(() => users.id),
    objectKey: text("object_key").notNull(),
    thumbnailKey: text("thumbnail_key"),
    displayKey: text("display_key"),
    contentType: text("content_type"),
    declaredContentType: text("declared_content_type"),
    sizeBytes: integer("size_bytes"),
    sha256: text("sha256"),
    width: integer("width"),
    height: integer("height"),
    takenAt: timestamp("taken_at", { withTimezone: true }),
    status: photoStatus("status").notNull().default("pending"),
    rejectReason: text("reject_reason"),
    /** UUID made on the phone for this upload: a retried start returns the same photo. */
    clientId: uuid("client_id"),
    createdAt: createdAt(),
  },
  (t) => [
    index("photos_member").on(t.memberId),
    index("photos_inspection").on(t.inspectionId),
    uniqueIndex("photos_site_client").on(t.siteId, t.clientId),
  ],
);

export const inspections = pgTable(
  "inspections",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    memberId: uuid("member_id").notNull().references(() => members.id, { onDelete: "cascade" }),
    inspectorId: uuid("inspector_id").references(() => users.id),
    result: inspectionResult("result").notNull(),
    items: jsonb("items").$type<{ check: string; result: "pass" | "fail"; note?: string }[]>().notNull().default([]),
    notes: text("notes"),
    /** Plumb reading: the angle from vertical used for the re-check (given, or worked out from the offset). */
    plumbDeg: doublePrecision("plumb_deg"),
    /** The reading as taken, when it was an offset: Δ (mm) over a height (mm; null = the member's length). */
    plumbOffsetMm: doublePrecision("plumb_offset_mm"),
    plumbOverMm: doublePrecision("plumb_over_mm"),
    inspectedAt: timestamp("inspected_at", { withTimezone: true }).notNull().defaultNow(),
    nextDueAt: timestamp("next_due_at", { withTimezone: true }),
    /** UUID made on the phone for this inspection: a retried request returns this one instead of a second. */
    clientId: uuid("client_id"),
    createdAt: createdAt(),
  },
  (t) => [index("inspections_member").on(t.memberId, t.inspectedAt), uniqueIndex("inspections_member_client").on(t.memberId, t.clientId)],
);

/** A coordinator's trigger ("after any incident or adverse weather"): inspections due now. */
export const inspectionTriggers = pgTable("inspection_triggers", {
  id: id(),
  siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
  zoneId: uuid("zone_id").references(() => zones.id),
  reason: text("reason").notNull(),
  triggeredBy: uuid("triggered_by").references(() => users.id),
  triggeredAt: timestamp("triggered_at", { withTimezone: true }).notNull().defaultNow(),
});

// ---------------------------------------------------------------- permits
export const permits = pgTable(
  "permits",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    kind: permitKind("kind").notNull(),
    /** Sequential per site, assigned at issue. */
    number: integer("number"),
    /** The request's own number on its site ("Request 14"), given when it is made; never reused. */
    requestNumber: integer("request_number").notNull(),
    status: permitStatus("status").notNull().default("requested"),
    schemeId: uuid("scheme_id").references(() => schemes.id),
    zoneId: uuid("zone_id").references(() => zones.id),
    requestedBy: uuid("requested_by").notNull().references(() => users.id),
    requestedAt: timestamp("requested_at", { withTimezone: true }).notNull().defaultNow(),
    requestNote: text("request_note"),
    /** Permit to strike: the evidence that the permanent works can carry themselves. */
    evidence: jsonb("evidence").$type<Record<string, unknown>>(),
    /** Earlier striking evidence replaced while the request was open, oldest first (never deleted). */
    evidenceHistory: jsonb("evidence_history")
      .$type<{ evidence: Record<string, unknown>; replacedAt: string; replacedBy: string; replacedByName: string }[]>()
      .notNull()
      .default([]),
    approvedBy: uuid("approved_by").references(() => users.id),
    issuedAt: timestamp("issued_at", { withTimezone: true }),
    validUntil: timestamp("valid_until", { withTimezone: true }),
    conditions: text("conditions"),
    recipients: jsonb("recipients").$type<string[]>().notNull().default([]),
    pdfKey: text("pdf_key"),
    refusedReason: text("refused_reason"),
    withdrawnReason: text("withdrawn_reason"),
    closedAt: timestamp("closed_at", { withTimezone: true }),
    closedBy: uuid("closed_by").references(() => users.id),
    struckConfirmedAt: timestamp("struck_confirmed_at", { withTimezone: true }),
    struckConfirmedBy: uuid("struck_confirmed_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("permits_site_number").on(t.siteId, t.kind, t.number),
    uniqueIndex("permits_site_request_number").on(t.siteId, t.requestNumber),
    index("permits_site_status").on(t.siteId, t.status),
  ],
);

export const permitMembers = pgTable(
  "permit_members",
  {
    permitId: uuid("permit_id").notNull().references(() => permits.id, { onDelete: "cascade" }),
    memberId: uuid("member_id").notNull().references(() => members.id, { onDelete: "cascade" }),
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedReason: text("removed_reason"),
  },
  (t) => [primaryKey({ columns: [t.permitId, t.memberId] }), index("permit_members_member").on(t.memberId)],
);

/**
 * A scheme's documents: every drawing revision and every design check certificate is kept (the
 * scheme's drawingKey / certificateKey point at the current one). A certificate names its checker,
 * the check category and the date (BS 5975:2019 §17.4 design check certificate).
 */
export const schemeDocuments = pgTable(
  "scheme_documents",
  {
    id: id(),
    schemeId: uuid("scheme_id").notNull().references(() => schemes.id, { onDelete: "cascade" }),
    kind: schemeDocumentKind("kind").notNull(),
    objectKey: text("object_key").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    /** Drawings: the drawing number and revision letter, and the revision's date. */
    drawingNumber: text("drawing_number"),
    revision: text("revision"),
    /** Certificates: who checked the design, in which design check category, on which date. */
    checkerName: text("checker_name"),
    checkCategory: integer("check_category"),
    /** The revision date of a drawing or the date of the check (a calendar date, YYYY-MM-DD). */
    documentDate: text("document_date"),
    /** An image of a signed page: the uploader confirmed it shows the whole signed certificate. */
    signedImageConfirmed: boolean("signed_image_confirmed").notNull().default(false),
    uploadedBy: uuid("uploaded_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("scheme_documents_scheme").on(t.schemeId, t.kind, t.createdAt)],
);

/** A coordinator lets a supervisor issue permits for some zones until a date. */
export const permitDelegations = pgTable("permit_delegations", {
  id: id(),
  siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
  userId: uuid("user_id").notNull().references(() => users.id),
  zoneIds: jsonb("zone_ids").$type<string[]>().notNull(),
  validUntil: timestamp("valid_until", { withTimezone: true }).notNull(),
  grantedBy: uuid("granted_by").notNull().references(() => users.id),
  revokedAt: timestamp("revoked_at", { withTimezone: true }),
  createdAt: createdAt(),
});

// ------------------------------------------------------ e-mail and alerts
/** Every e-mail is written here in the same transaction as its cause; the worker delivers it. */
export const outbox = pgTable(
  "outbox",
  {
    id: id(),
    siteId: uuid("site_id").references(() => sites.id, { onDelete: "set null" }),
    kind: text("kind").notNull(),
    toEmail: text("to_email").notNull(),
    toUserId: uuid("to_user_id").references(() => users.id),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html"),
    /** Object keys in S3 to attach ({ key, filename, contentType }). */
    attachments: jsonb("attachments").$type<{ key: string; filename: string; contentType: string }[]>().notNull().default([]),
    /** Set when an attachment is still being produced (a permit PDF): deliver once it is ready. */
    waitFor: text("wait_for"),
    relatedType: text("related_type"),
    relatedId: uuid("related_id"),
    status: outboxStatus("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lockedUntil: timestamp("locked_until", { withTimezone: true }),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index("outbox_due").on(t.status, t.nextAttemptAt), index("outbox_related").on(t.relatedType, t.relatedId)],
);

export const outboxAttempts = pgTable("outbox_attempts", {
  id: bigserial("id", { mode: "number" }).primaryKey(),
  outboxId: uuid("outbox_id").notNull().references(() => outbox.id, { onDelete: "cascade" }),
  at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  ok: boolean("ok").notNull(),
  error: text("error"),
  worker: text("worker"),
});

export const alerts = pgTable(
  "alerts",
  {
    id: id(),
    siteId: uuid("site_id").notNull().references(() => sites.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: uuid("subject_id").notNull(),
    /** With kind and subject, makes an alert fire once per threshold crossing. */
    threshold: text("threshold").notNull(),
    title: text("title").notNull(),
    body: text("body").notNull(),
    link: text("link"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("alerts_once").on(t.kind, t.subjectId, t.threshold), index("alerts_site").on(t.siteId, t.createdAt)],
);

export const alertReads = pgTable(
  "alert_reads",
  {
    alertId: uuid("alert_id").notNull().references(() => alerts.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    readAt: timestamp("read_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.alertId, t.userId] })],
);

export const alertPreferences = pgTable(
  "alert_preferences",
  {
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    delivery: alertDelivery("delivery").notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

// ------------------------------------------------------------------ audit
/** Append-only: a database trigger refuses UPDATE and DELETE (see the migration). */
export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    organisationId: uuid("organisation_id").notNull(),
    siteId: uuid("site_id"),
    actorId: uuid("actor_id"),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: uuid("entity_id"),
    before: jsonb("before"),
    after: jsonb("after"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_entity").on(t.entityType, t.entityId, t.at), index("audit_site").on(t.siteId, t.at)],
);

// -------------------------------------------------------------- relations
export const sitesRelations = relations(sites, ({ one, many }) => ({
  organisation: one(organisations, { fields: [sites.organisationId], references: [organisations.id] }),
  memberships: many(memberships),
}));
export const membershipsRelations = relations(memberships, ({ one }) => ({
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
  site: one(sites, { fields: [memberships.siteId], references: [sites.id] }),
}));
export const membersRelations = relations(members, ({ one, many }) => ({
  site: one(sites, { fields: [members.siteId], references: [sites.id] }),
  zone: one(zones, { fields: [members.zoneId], references: [zones.id] }),
  scheme: one(schemes, { fields: [members.schemeId], references: [schemes.id] }),
  memberType: one(memberTypes, { fields: [members.memberTypeId], references: [memberTypes.id] }),
  checks: many(checks),
  photos: many(photos),
}));
export const checksRelations = relations(checks, ({ one }) => ({
  member: one(members, { fields: [checks.memberId], references: [members.id] }),
}));
export const photosRelations = relations(photos, ({ one }) => ({
  member: one(members, { fields: [photos.memberId], references: [members.id] }),
}));

// ------------------------------------------------------------------ types
export type Organisation = typeof organisations.$inferSelect;
export type User = typeof users.$inferSelect;
export type Site = typeof sites.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type SiteRole = (typeof siteRole.enumValues)[number];
export type Zone = typeof zones.$inferSelect;
export type Scheme = typeof schemes.$inferSelect;
export type MemberType = typeof memberTypes.$inferSelect;
export type Member = typeof members.$inferSelect;
export type NewMember = typeof members.$inferInsert;
export type Check = typeof checks.$inferSelect;
export type Photo = typeof photos.$inferSelect;
export type Inspection = typeof inspections.$inferSelect;
export type Permit = typeof permits.$inferSelect;
export type SchemeDocument = typeof schemeDocuments.$inferSelect;
export type OutboxMessage = typeof outbox.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
