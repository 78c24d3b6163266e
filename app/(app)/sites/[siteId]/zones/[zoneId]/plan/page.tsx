import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { getZone } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { zonePlanView } from "@/lib/zone-plans";
import { PlanUpload } from "./plan-upload";
import { PlanView } from "./plan-view";

export const metadata: Metadata = { title: "Zone plan" };

export default async function ZonePlanPage({ params }: { params: Promise<{ siteId: string; zoneId: string }> }) {
  const { siteId, zoneId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!isUuid(zoneId)) notFound();
  const zone = await getZone({ siteId: site.id, zoneId });
  if (!zone) notFound();
  // The same view as GET /api/v1/sites/{siteId}/zones/{zoneId}/plan.
  const plan = await zonePlanView({ site, zone });
  const facts = [zone.level ? `Level ${zone.level}` : null, zone.grid ? `grid ${zone.grid}` : null, zone.area].filter(Boolean).join(" · ");
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-col gap-1">
        <p className="text-sm text-ink-soft">
          <a href={`/sites/${site.id}`} className="underline">Overview</a> / <a href={`/sites/${site.id}/members?zoneId=${zone.id}`} className="underline">Register: this zone</a> / plan
        </p>
        <h1 className="text-2xl font-bold">{zone.name}: plan</h1>
        {facts ? <p className="text-ink-soft">{facts}</p> : null}
        {plan.uploadedAt ? (
          <p className="text-sm text-ink-soft">
            Plan uploaded {new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: site.timezone }).format(plan.uploadedAt)}
            {plan.uploadedByName ? ` by ${plan.uploadedByName}` : ""}
            {plan.sourceType === "application/pdf" ? " (from a PDF)" : ""}.
          </p>
        ) : null}
      </header>
      <CautionNotice compact />
      <PlanView
        siteId={site.id}
        zoneId={zone.id}
        plan={{ imageUrl: plan.imageUrl, width: plan.width, height: plan.height, zoneName: plan.zoneName, pins: plan.pins, unpinned: plan.unpinned }}
        canPlace={may("editMember")}
      />
      {may("manageZones") ? <PlanUpload siteId={site.id} zoneId={zone.id} hasPlan={!!plan.imageUrl} /> : null}
    </div>
  );
}
