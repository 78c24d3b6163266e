// Schemes (temporary works designs) and zones (where on site), with their drawing and check
// certificate files uploaded straight to the store and confirmed by the server.
import "server-only";
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getScheme, getSchemeByReference, insertScheme, updateScheme as updateSchemeRow } from "@/db/queries/schemes";
import type { SessionUser } from "@/db/queries/users";
import { getZone, getZoneByName, insertZone, updateZone as updateZoneRow } from "@/db/queries/zones";
import { assertSitePermission, isUuid } from "@/lib/authz";
import { fieldErrorsFromZod, NotFoundError, ValidationError } from "@/lib/errors";
import { deleteObject, getObject, headObject, presignGet, presignPut } from "@/lib/storage";
import { schemeFileCompleteSchema, schemeFilePresignSchema, schemeSchema } from "@/lib/validations/scheme";
import { zoneSchema } from "@/lib/validations/zone";

function parse<T>(schema: { safeParse: (v: unknown) => { success: true; data: T } | { success: false; error: { issues: { path: PropertyKey[]; message: string }[] } } }, input: unknown): T {
  const r = schema.safeParse(input);
  if (!r.success) throw new ValidationError(fieldErrorsFromZod(r.error.issues));
  return r.data;
}

export async function createZone({ user, siteId, input }: { user: SessionUser; siteId: string; input: unknown }) {
  const { site } = await assertSitePermission(user, siteId, "manageZones");
  const v = parse(zoneSchema, input);
  return db.transaction(async (tx) => {
    if (await getZoneByName({ siteId: site.id, name: v.name }, tx)) throw new ValidationError({ name: `This site already has a zone called "${v.name}".` });
    const zone = await insertZone({ siteId: site.id, ...v }, tx);
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "zone.created", entityType: "zone", entityId: zone.id, after: v }, tx);
    return { zone };
  });
}

export async function editZone({ user, siteId, zoneId, input }: { user: SessionUser; siteId: string; zoneId: string; input: unknown }) {
  const { site } = await assertSitePermission(user, siteId, "manageZones");
  if (!isUuid(zoneId)) throw new NotFoundError("That zone");
  const before = await getZone({ siteId: site.id, zoneId });
  if (!before) throw new NotFoundError("That zone");
  const v = parse(zoneSchema, input);
  return db.transaction(async (tx) => {
    const clash = await getZoneByName({ siteId: site.id, name: v.name }, tx);
    if (clash && clash.id !== zoneId) throw new ValidationError({ name: `This site already has a zone called "${v.name}".` });
    const zone = (await updateZoneRow({ siteId: site.id, zoneId, values: v }, tx))!;
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "zone.updated", entityType: "zone", entityId: zoneId, before, after: v }, tx);
    return { zone };
  });
}

export async function createScheme({ user, siteId, input }: { user: SessionUser; siteId: string; input: unknown }) {
  const { site } = await assertSitePermission(user, siteId, "manageSchemes");
  const v = parse(schemeSchema, input);
  return db.transaction(async (tx) => {
    if (await getSchemeByReference({ siteId: site.id, reference: v.reference }, tx)) {
      throw new ValidationError({ reference: `This site already has a scheme ${v.reference}.` });
    }
    const scheme = await insertScheme({ ...v, siteId: site.id, createdBy: user.id }, tx);
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "scheme.created", entityType: "scheme", entityId: scheme.id, after: v }, tx);
    return { scheme };
  });
}

async function loadScheme(user: SessionUser, siteId: string, schemeId: string) {
  const { site } = await assertSitePermission(user, siteId, "manageSchemes");
  if (!isUuid(schemeId)) throw new NotFoundError("That scheme");
  const scheme = await getScheme({ siteId: site.id, schemeId });
  if (!scheme) throw new NotFoundError("That scheme");
  return { site, scheme };
}

export async function editScheme({ user, siteId, schemeId, input }: { user: SessionUser; siteId: string; schemeId: string; input: unknown }) {
  const { site, scheme: before } = await loadScheme(user, siteId, schemeId);
  const v = parse(schemeSchema, input);
  return db.transaction(async (tx) => {
    const clash = await getSchemeByReference({ siteId: site.id, reference: v.reference }, tx);
    if (clash && clash.id !== schemeId) throw new ValidationError({ reference: `This site already has a scheme ${v.reference}.` });
    const scheme = (await updateSchemeRow({ siteId: site.id, schemeId, values: v }, tx))!;
    const { createdAt: _c, updatedAt: _u, ...b } = before;
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "scheme.updated", entityType: "scheme", entityId: schemeId, before: b, after: v }, tx);
    return { scheme };
  });
}

/** Starts the upload of a drawing or check certificate: a presigned PUT the browser sends the file to. */
export async function presignSchemeFile({ user, siteId, schemeId, input }: { user: SessionUser; siteId: string; schemeId: string; input: unknown }) {
  const { site } = await loadScheme(user, siteId, schemeId);
  const v = parse(schemeFilePresignSchema, input);
  const key = `sites/${site.id}/schemes/${schemeId}/${v.kind}-${randomUUID()}`;
  return { key, uploadUrl: await presignPut(key, v.contentType), headers: { "content-type": v.contentType } };
}

/** Checks the uploaded file is really a PDF or an image, then records it on the scheme. */
export async function completeSchemeFile({ user, siteId, schemeId, input }: { user: SessionUser; siteId: string; schemeId: string; input: unknown }) {
  const { site, scheme } = await loadScheme(user, siteId, schemeId);
  const v = parse(schemeFileCompleteSchema, input);
  if (!v.key.startsWith(`sites/${site.id}/schemes/${schemeId}/${v.kind}-`)) throw new ValidationError({ key: "That upload does not belong to this scheme; start the upload again." });
  const head = await headObject(v.key);
  if (!head) throw new ValidationError({ file: "The file has not arrived in the store; upload it again." });
  const bytes = await getObject(v.key);
  let contentType: string | null = null;
  if (bytes.subarray(0, 5).toString("latin1") === "%PDF-") contentType = "application/pdf";
  else {
    const meta = await sharp(bytes).metadata().catch(() => null);
    if (meta?.format && ["jpeg", "png", "webp"].includes(meta.format)) contentType = `image/${meta.format}`;
  }
  if (!contentType) {
    await deleteObject(v.key).catch(() => undefined);
    throw new ValidationError({ file: "The file is neither a PDF nor a JPEG/PNG/WebP image (its contents were checked, not its name); upload the drawing as a PDF." });
  }
  const field = v.kind === "drawing" ? "drawingKey" : "certificateKey";
  return db.transaction(async (tx) => {
    const updated = (await updateSchemeRow({ siteId: site.id, schemeId, values: { [field]: v.key } }, tx))!;
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: `scheme.${v.kind}_uploaded`, entityType: "scheme", entityId: schemeId, before: { [field]: scheme[field] }, after: { [field]: v.key, contentType, sizeBytes: head.size } },
      tx,
    );
    return { scheme: updated, url: await presignGet(v.key) };
  });
}
