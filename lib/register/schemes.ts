// Schemes (temporary works designs) and zones (where on site), with their drawing and check
// certificate files uploaded straight to the store and confirmed by the server. Zone and scheme
// routes are on the seam (lib/api/route.ts): it finds the site and record, checks the role and
// parses the body, so these use cases take that context.
import "server-only";
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getScheme, getSchemeByReference, insertScheme, updateScheme as updateSchemeRow, type SchemeView } from "@/db/queries/schemes";
import type { SessionUser } from "@/db/queries/users";
import { getZoneByName, insertZone, updateZone as updateZoneRow, type ZoneView } from "@/db/queries/zones";
import { assertSitePermission, isUuid } from "@/lib/authz";
import { fieldErrorsFromZod, NotFoundError, ValidationError } from "@/lib/errors";
import { deleteObject, getObject, headObject, presignGet, presignPut } from "@/lib/storage";
import { schemeFileCompleteSchema, schemeFilePresignSchema, type SchemeParsed } from "@/lib/validations/scheme";
import type { z } from "zod";
import type { zoneSchema } from "@/lib/validations/zone";

type ZoneParsed = z.output<typeof zoneSchema>;

function parse<T>(schema: { safeParse: (v: unknown) => { success: true; data: T } | { success: false; error: { issues: { path: PropertyKey[]; message: string }[] } } }, input: unknown): T {
  const r = schema.safeParse(input);
  if (!r.success) throw new ValidationError(fieldErrorsFromZod(r.error.issues));
  return r.data;
}

type OnSite = { id: string; organisationId: string };

export async function createZone({ user, site, input: v }: { user: SessionUser; site: OnSite; input: ZoneParsed }) {
  return transaction(async (tx) => {
    if (await getZoneByName({ siteId: site.id, name: v.name }, tx)) throw new ValidationError({ name: `This site already has a zone called "${v.name}".` });
    const zone = await insertZone({ siteId: site.id, ...v }, tx);
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "zone.created", entityType: "zone", entityId: zone.id, after: v }, tx);
    return { zone };
  });
}

export async function editZone({ user, site, zone: before, input: v }: { user: SessionUser; site: OnSite; zone: ZoneView; input: ZoneParsed }) {
  const zoneId = before.id;
  return transaction(async (tx) => {
    const clash = await getZoneByName({ siteId: site.id, name: v.name }, tx);
    if (clash && clash.id !== zoneId) throw new ValidationError({ name: `This site already has a zone called "${v.name}".` });
    const zone = (await updateZoneRow({ siteId: site.id, zoneId, values: v }, tx))!;
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "zone.updated", entityType: "zone", entityId: zoneId, before, after: v }, tx);
    return { zone };
  });
}

export async function createScheme({ user, site, input: v }: { user: SessionUser; site: OnSite; input: SchemeParsed }) {
  return transaction(async (tx) => {
    if (await getSchemeByReference({ siteId: site.id, reference: v.reference }, tx)) {
      throw new ValidationError({ reference: `This site already has a scheme ${v.reference}.` });
    }
    const scheme = await insertScheme({ ...v, siteId: site.id, createdBy: user.id }, tx);
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "scheme.created", entityType: "scheme", entityId: scheme.id, after: v }, tx);
    return { scheme };
  });
}

// Scheme files (presign/complete below) are the permits helper's to move onto the seam; until then
// they find the scheme and check the role here.
async function loadScheme(user: SessionUser, siteId: string, schemeId: string) {
  const { site } = await assertSitePermission(user, siteId, "manageSchemes");
  if (!isUuid(schemeId)) throw new NotFoundError("That scheme");
  const scheme = await getScheme({ siteId: site.id, schemeId });
  if (!scheme) throw new NotFoundError("That scheme");
  return { site, scheme };
}

export async function editScheme({ user, site, scheme: before, input: v }: { user: SessionUser; site: OnSite; scheme: SchemeView; input: SchemeParsed }) {
  const schemeId = before.id;
  return transaction(async (tx) => {
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
  return transaction(async (tx) => {
    const updated = (await updateSchemeRow({ siteId: site.id, schemeId, values: { [field]: v.key } }, tx))!;
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: `scheme.${v.kind}_uploaded`, entityType: "scheme", entityId: schemeId, before: { [field]: scheme[field] }, after: { [field]: v.key, contentType, sizeBytes: head.size } },
      tx,
    );
    return { scheme: updated, url: await presignGet(v.key) };
  });
}
