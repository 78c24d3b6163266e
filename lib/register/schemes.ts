// Schemes (temporary works designs) and zones (where on site), with their drawing and check
// certificate files uploaded straight to the store and confirmed by the server. Zone and scheme
// routes are on the seam (lib/api/route.ts): it finds the site and record, checks the role and
// parses the body, so these use cases take that context.
import "server-only";
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import type { z } from "zod";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getSchemeByReference, insertScheme, updateScheme as updateSchemeRow, type SchemeView } from "@/db/queries/schemes";
import { insertSchemeDocument, listSchemeDocuments } from "@/db/queries/scheme-documents";
import type { SessionUser } from "@/db/queries/users";
import type { ResourceOf, Site } from "@/lib/api/resources";
import { getZoneByName, insertZone, updateZone as updateZoneRow, type ZoneView } from "@/db/queries/zones";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { recheckMembersOfScheme, SCHEME_LOAD_FIELDS, type SiteForCheck } from "./members";
import { deleteObject, getObject, headObject, presignGet, presignPut } from "@/lib/storage";
import { schemeFilePresignSchema, type SchemeFileComplete, type SchemeParsed } from "@/lib/validations/scheme";
import type { zoneSchema } from "@/lib/validations/zone";

type ZoneParsed = z.output<typeof zoneSchema>;

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

/** Back-propping loads are multiples of the slab's self-weight: a scheme with back-propping needs its slab (checked on the stored row, so a PATCH that keeps either is judged as a whole). */
function assertBackpropHasSlab(scheme: Pick<SchemeView, "backprop" | "slabThicknessMm">) {
  if (scheme.backprop && scheme.slabThicknessMm == null) {
    throw new ValidationError({ backprop: "Back-propping loads are multiples of the slab's self-weight: give the slab thickness (mm) with the back-propping." });
  }
}

export async function createScheme({ user, site, input: v }: { user: SessionUser; site: OnSite; input: SchemeParsed }) {
  return transaction(async (tx) => {
    if (await getSchemeByReference({ siteId: site.id, reference: v.reference }, tx)) {
      throw new ValidationError({ reference: `This site already has a scheme ${v.reference}.` });
    }
    const scheme = await insertScheme({ ...v, siteId: site.id, createdBy: user.id }, tx);
    assertBackpropHasSlab(scheme);
    await recordAudit({ organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "scheme.created", entityType: "scheme", entityId: scheme.id, after: v }, tx);
    return { scheme };
  });
}

/**
 * Edits a scheme. A change to what a derived load depends on (the slab) re-derives and re-checks
 * every member that takes its load from the scheme, in the same transaction: the answer says how
 * many (`rechecked`).
 */
export async function editScheme({ user, site, scheme: before, input: v }: { user: SessionUser; site: SiteForCheck; scheme: SchemeView; input: SchemeParsed }) {
  const schemeId = before.id;
  return transaction(async (tx) => {
    const clash = await getSchemeByReference({ siteId: site.id, reference: v.reference }, tx);
    if (clash && clash.id !== schemeId) throw new ValidationError({ reference: `This site already has a scheme ${v.reference}.` });
    const scheme = (await updateSchemeRow({ siteId: site.id, schemeId, values: v }, tx))!;
    assertBackpropHasSlab(scheme);
    const changed = SCHEME_LOAD_FIELDS.filter((k) => JSON.stringify(before[k] ?? null) !== JSON.stringify(scheme[k] ?? null));
    const { rechecked } = changed.length ? await recheckMembersOfScheme({ user, site, scheme, changed, tx }) : { rechecked: 0 };
    const { createdAt: _c, updatedAt: _u, ...b } = before;
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "scheme.updated", entityType: "scheme", entityId: schemeId, before: b, after: { ...v, rechecked } },
      tx,
    );
    return { scheme, rechecked };
  });
}

/** Starts the upload of a drawing or check certificate: a presigned PUT the browser sends the file to. */
export async function presignSchemeFile({ site, resource: scheme, input: v }: { site: Site; resource: ResourceOf<"scheme">; input: z.output<typeof schemeFilePresignSchema> }) {
  const key = `sites/${site.id}/schemes/${scheme.id}/${v.kind}-${randomUUID()}`;
  return { key, uploadUrl: await presignPut(key, v.contentType), headers: { "content-type": v.contentType } };
}

/** The next revision letter of a drawing (A, B, … Z, AA…), or null when the last one is not a plain letter. */
function nextRevision(last: string | null | undefined): string | null {
  if (!last) return "A";
  if (!/^[A-Z]{1,2}$/.test(last)) return null;
  if (last === "Z") return "AA";
  const head = last.slice(0, -1);
  const tail = last.slice(-1);
  return tail === "Z" ? null : `${head}${String.fromCharCode(tail.charCodeAt(0) + 1)}`;
}

/**
 * Checks the uploaded file is really a PDF or an image, and that a certificate names its checker,
 * category and date (an image only as a confirmed picture of the signed page); then keeps it as a
 * new document of the scheme (drawings keep every revision) and makes it the scheme's current one.
 */
export async function completeSchemeFile({ user, site, resource: scheme, input: v }: { user: SessionUser; site: Site; resource: ResourceOf<"scheme">; input: SchemeFileComplete }) {
  const schemeId = scheme.id;
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
  const fields: Record<string, string> = {};
  if (!contentType)
    fields.file = "The file is neither a PDF nor a JPEG/PNG/WebP image (its contents were checked, not its name); upload the drawing as a PDF.";
  const today = new Date().toISOString().slice(0, 10);
  const documents = await listSchemeDocuments({ schemeId, kind: v.kind });
  let revision: string | null = null;
  if (v.kind === "certificate") {
    if (!v.checkerName) fields.checkerName = "Name the person who checked the design (as on the certificate).";
    if (v.checkCategory == null) fields.checkCategory = "Choose the design check category the certificate is for (0 to 3).";
    else if (v.checkCategory < scheme.category)
      fields.checkCategory = `This scheme is design check category ${scheme.category}; a category ${v.checkCategory} check does not cover it.`;
    if (!v.documentDate) fields.documentDate = "Give the date of the check, as on the certificate.";
    else if (v.documentDate > today) fields.documentDate = "The date of the check cannot be in the future.";
    if (contentType?.startsWith("image/") && v.signedImageConfirmed !== true)
      fields.signedImageConfirmed = "An image is accepted only as a photo or scan of the signed certificate: confirm it shows the whole signed page, or upload the PDF.";
  } else {
    const sameDrawing = documents.filter((d) => (d.drawingNumber ?? null) === (v.drawingNumber ?? null));
    if (v.revision) {
      if (sameDrawing.some((d) => d.revision === v.revision))
        fields.revision = `Revision ${v.revision}${v.drawingNumber ? ` of drawing ${v.drawingNumber}` : ""} is already recorded; give the new revision's letter.`;
      revision = v.revision;
    } else {
      revision = nextRevision(sameDrawing[0]?.revision);
      if (!revision) fields.revision = `Give the revision of this drawing (the last one recorded is ${sameDrawing[0]?.revision}).`;
    }
    if (v.documentDate && v.documentDate > today) fields.documentDate = "A drawing revision's date cannot be in the future.";
  }
  if (Object.keys(fields).length) {
    if (!contentType) await deleteObject(v.key).catch(() => undefined);
    throw new ValidationError(fields);
  }
  const field = v.kind === "drawing" ? "drawingKey" : "certificateKey";
  return transaction(async (tx) => {
    const document = await insertSchemeDocument(
      {
        schemeId,
        kind: v.kind,
        objectKey: v.key,
        contentType: contentType!,
        sizeBytes: head.size,
        drawingNumber: v.kind === "drawing" ? (v.drawingNumber ?? null) : null,
        revision,
        checkerName: v.kind === "certificate" ? v.checkerName! : null,
        checkCategory: v.kind === "certificate" ? v.checkCategory! : null,
        documentDate: v.documentDate ?? today,
        signedImageConfirmed: v.kind === "certificate" && contentType!.startsWith("image/") && v.signedImageConfirmed === true,
        uploadedBy: user.id,
      },
      tx,
    );
    const updated = (await updateSchemeRow({ siteId: site.id, schemeId, values: { [field]: v.key } }, tx))!;
    await recordAudit(
      {
        organisationId: site.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: `scheme.${v.kind}_uploaded`,
        entityType: "scheme",
        entityId: schemeId,
        before: { [field]: scheme[field] },
        after: { [field]: v.key, contentType, sizeBytes: head.size, documentId: document.id, drawingNumber: document.drawingNumber, revision, checkerName: document.checkerName, checkCategory: document.checkCategory, documentDate: document.documentDate },
      },
      tx,
    );
    return { scheme: updated, document, url: await presignGet(v.key) };
  });
}
