// Sites: an organisation admin adds them, changes their policies and archives them.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { createSite, siteCodeTaken, updateSite, type SiteValues } from "@/db/queries/sites";
import type { SessionUser } from "@/lib/auth";
import { ConflictError } from "@/lib/errors";
import { designCodeFor, type SitePatchInput, type siteCreateSchema } from "@/lib/validations/onboarding";
import type { z } from "zod";
import type { Site } from "@/lib/api/resources";

/** The API's words for a site (units, basis, days) beside the stored columns. */
export function siteView(site: Site) {
  return {
    ...site,
    units: site.unitSystem,
    basis: site.designCode === "en1993" ? "eurocode" : "aisc",
    permitValidityDays: Math.round((site.permitValidityHours / 24) * 100) / 100,
    permitWarningHours: site.expiryWarningHours,
    archived: !!site.archivedAt,
  };
}

const codeTaken = () =>
  new ConflictError("Another site of your organisation already uses that code.", { code: "Another site of your organisation already uses that code." });

export async function addSite({ user, input }: { user: SessionUser; input: z.output<typeof siteCreateSchema> }) {
  const values: SiteValues = {
    name: input.name,
    code: input.code.toUpperCase(),
    address: input.address ?? null,
    unitSystem: input.units,
    designCode: designCodeFor(input.basis),
    inspectionIntervalDays: input.inspectionIntervalDays,
    permitValidityHours: input.permitValidityDays * 24,
    expiryWarningHours: input.permitWarningHours,
    timezone: input.timezone,
  };
  return transaction(async (tx) => {
    if (await siteCodeTaken({ organisationId: user.organisationId, code: values.code }, tx)) throw codeTaken();
    const site = await createSite({ organisationId: user.organisationId, values }, tx);
    await recordAudit({ organisationId: user.organisationId, siteId: site.id, actorId: user.id, action: "site.created", entityType: "site", entityId: site.id, after: values }, tx);
    return site;
  });
}

export async function changeSite({ user, site, input }: { user: SessionUser; site: Site; input: SitePatchInput }) {
  const values: Partial<SiteValues> & { archivedAt?: Date | null } = {};
  if (input.name !== undefined) values.name = input.name;
  if (input.code !== undefined) values.code = input.code.toUpperCase();
  if (input.address !== undefined) values.address = input.address ?? null;
  if (input.units !== undefined) values.unitSystem = input.units;
  if (input.basis !== undefined) values.designCode = designCodeFor(input.basis);
  if (input.inspectionIntervalDays !== undefined) values.inspectionIntervalDays = input.inspectionIntervalDays;
  if (input.permitValidityDays !== undefined) values.permitValidityHours = input.permitValidityDays * 24;
  if (input.permitWarningHours !== undefined) values.expiryWarningHours = input.permitWarningHours;
  if (input.timezone !== undefined) values.timezone = input.timezone;
  if (input.archived !== undefined) values.archivedAt = input.archived ? (site.archivedAt ?? new Date()) : null;
  return transaction(async (tx) => {
    if (values.code && (await siteCodeTaken({ organisationId: user.organisationId, code: values.code, exceptSiteId: site.id }, tx))) throw codeTaken();
    const updated = await updateSite({ siteId: site.id, values }, tx);
    const before = Object.fromEntries(Object.keys(values).map((k) => [k, (site as Record<string, unknown>)[k]]));
    const action = input.archived === true && !site.archivedAt ? "site.archived" : input.archived === false && site.archivedAt ? "site.restored" : "site.updated";
    await recordAudit({ organisationId: user.organisationId, siteId: site.id, actorId: user.id, action, entityType: "site", entityId: site.id, before, after: values }, tx);
    return updated;
  });
}
