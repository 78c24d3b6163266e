// Zone plans: a presigned PUT straight to the store, then a completion that reads the bytes,
// renders a PDF or scales an image, and records the plan on the zone (audited). The plan view
// lists every member of the zone: those placed on it as pins with their current check, the rest
// beside it. Routes are on the seam (lib/api/route.ts); these use cases take its context.
import "server-only";
import { randomUUID } from "node:crypto";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import type { SessionUser } from "@/db/queries/users";
import { getZonePlan, listZonePlanMembers, setZonePlan, type ZonePlanMember, type ZonePlanRow } from "@/db/queries/zone-plans";
import type { PlanScale } from "@/db/schema";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { deleteObject, getObject, headObject, presignGet, presignPut, putObject } from "@/lib/storage";
import { MAX_PLAN_BYTES, type ZonePlanComplete, type ZonePlanQuery } from "@/lib/validations/zone-plan";
import { pinLook } from "./pin-look";
import { processPlan } from "./process";

type OnSite = { id: string; organisationId: string };
type Zone = { id: string; name: string };

const prefix = (siteId: string, zoneId: string) => `sites/${siteId}/zones/${zoneId}/plan-`;

/** Starts a plan upload: the URL the browser PUTs the file to. */
export async function presignZonePlan({ site, zone, input }: { site: OnSite; zone: Zone; input: { contentType: string; size: number } }) {
  const key = `${prefix(site.id, zone.id)}${randomUUID()}/source`;
  return {
    key,
    uploadUrl: await presignPut(key, input.contentType),
    method: "PUT" as const,
    headers: { "content-type": input.contentType },
    maxBytes: MAX_PLAN_BYTES,
  };
}

async function refuse(key: string, reason: string): Promise<never> {
  await deleteObject(key).catch(() => undefined);
  throw new ValidationError({ file: reason }, reason);
}

/** Checks the uploaded file (size, type from its bytes), makes the plan image and records it on the zone. */
export async function completeZonePlan({ user, site, zone, input }: { user: SessionUser; site: OnSite; zone: Zone; input: ZonePlanComplete }) {
  if (!input.key.startsWith(prefix(site.id, zone.id)) || !input.key.endsWith("/source"))
    throw new ValidationError({ key: "That upload does not belong to this zone's plan; start the upload again." });
  const head = await headObject(input.key);
  if (!head) throw new ValidationError({ file: "The plan has not arrived in the store yet; upload it again." });
  if (head.size === 0) await refuse(input.key, "The uploaded file is empty (0 bytes); upload the plan again.");
  if (head.size > MAX_PLAN_BYTES)
    await refuse(input.key, `The uploaded file is ${(head.size / 1048576).toFixed(1)} MB; a plan may be at most 20 MB. Export it at a lower resolution or as a PDF.`);
  const bytes = await getObject(input.key);
  const out = await processPlan(bytes);
  if (!out.ok) return refuse(input.key, out.reason);
  const p = out.plan;
  const imageKey = input.key.replace(/\/source$/, p.imageType === "image/png" ? "/plan.png" : "/plan.jpg");
  await putObject(imageKey, p.image, p.imageType);
  const before = await getZonePlan({ siteId: site.id, zoneId: zone.id });
  const scale: PlanScale | null = input.scale ?? null;
  await transaction(async (tx) => {
    await setZonePlan(
      {
        siteId: site.id,
        zoneId: zone.id,
        values: { planImageKey: imageKey, planSourceKey: input.key, planSourceType: p.sourceType, planWidth: p.width, planHeight: p.height, planScale: scale, planUploadedBy: user.id, planUploadedAt: new Date() },
      },
      tx,
    );
    await recordAudit(
      {
        organisationId: site.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: "zone.plan_uploaded",
        entityType: "zone",
        entityId: zone.id,
        before: before?.planImageKey ? { planImageKey: before.planImageKey, planSourceType: before.planSourceType, planWidth: before.planWidth, planHeight: before.planHeight, planScale: before.planScale } : null,
        after: { planImageKey: imageKey, planSourceKey: input.key, planSourceType: p.sourceType, planWidth: p.width, planHeight: p.height, planScale: scale, uploadedBytes: head.size },
      },
      tx,
    );
  });
  return zonePlanView({ site, zone });
}

export type PlanPin = { memberId: string; tag: string; x: number; y: number; status: ZonePlanMember["status"]; pass: boolean | null; utilisation: number | null; capacityN: number | null; loadN: number; typeName: string; word: string };
export type PlanUnpinned = Omit<PlanPin, "x" | "y">;

export type ZonePlanView = {
  zoneId: string;
  zoneName: string;
  imageUrl: string | null;
  width: number | null;
  height: number | null;
  scale: PlanScale | null;
  sourceType: string | null;
  uploadedAt: Date | null;
  uploadedByName: string | null;
  pins: PlanPin[];
  unpinned: PlanUnpinned[];
  /** Members in the zone before any filter. */
  total: number;
};

function matches(m: ZonePlanMember, q: ZonePlanQuery | undefined) {
  if (!q) return true;
  if (q.status && m.status !== q.status) return false;
  if (q.check === "pass" && m.pass !== true) return false;
  if (q.check === "fail" && m.pass !== false) return false;
  if (q.check === "none" && m.pass != null) return false;
  if (q.q && !m.tag.toLowerCase().includes(q.q.toLowerCase())) return false;
  return true;
}

/** The plan with its pins (each member's current check) and the members not placed on it. */
export async function zonePlanView({ site, zone, query }: { site: OnSite; zone: Zone; query?: ZonePlanQuery }): Promise<ZonePlanView> {
  const plan: ZonePlanRow | null = await getZonePlan({ siteId: site.id, zoneId: zone.id });
  if (!plan) throw new NotFoundError("That zone");
  const all = await listZonePlanMembers({ siteId: site.id, zoneId: zone.id });
  const hasPlan = plan.planImageKey != null;
  const pins: PlanPin[] = [];
  const unpinned: PlanUnpinned[] = [];
  for (const m of all) {
    if (!matches(m, query)) continue;
    const { x, y, ...rest } = m;
    const item = { ...rest, word: pinLook(m).word };
    if (hasPlan && x != null && y != null) pins.push({ ...item, x, y });
    else unpinned.push(item);
  }
  return {
    zoneId: plan.zoneId,
    zoneName: plan.name,
    imageUrl: plan.planImageKey ? await presignGet(plan.planImageKey) : null,
    width: plan.planWidth,
    height: plan.planHeight,
    scale: plan.planScale,
    sourceType: plan.planSourceType,
    uploadedAt: plan.planUploadedAt,
    uploadedByName: plan.planUploadedByName,
    pins,
    unpinned,
    total: all.length,
  };
}

/** The plan image's bytes, for the printed plan. */
export async function zonePlanImage({ site, zone }: { site: OnSite; zone: Zone }) {
  const plan = await getZonePlan({ siteId: site.id, zoneId: zone.id });
  if (!plan?.planImageKey) return null;
  return { bytes: await getObject(plan.planImageKey), width: plan.planWidth!, height: plan.planHeight!, png: plan.planImageKey.endsWith(".png") };
}
