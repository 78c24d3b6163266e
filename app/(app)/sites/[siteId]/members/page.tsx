import type { Metadata } from "next";
import { Suspense } from "react";
import { CautionNotice } from "@/components/caution-notice";
import { ZonePlanLinks } from "@/components/plan/zone-plan-links";
import { getRegisterFilterOptions } from "@/db/queries/member-list";
import { listZonesWithPlan } from "@/db/queries/zone-plans";
import { loadSitePage } from "@/lib/auth/site-page";
import { RegisterView } from "./register-view";

export const metadata: Metadata = { title: "Register" };

export default async function RegisterPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  const [options, zones] = await Promise.all([getRegisterFilterOptions({ siteId: site.id, organisationId: site.organisationId }), listZonesWithPlan({ siteId: site.id })]);
  return (
    <div className="flex flex-col gap-4">
      <Suspense fallback={<p className="text-ink-soft">Loading the register…</p>}>
        <RegisterView
          siteId={site.id}
          siteName={site.name}
          unitSystem={site.unitSystem}
          timeZone={site.timezone}
          options={options}
          canImport={may("importMembers")}
          canLog={may("logMember")}
          canRequestPermit={may("requestPermit")}
          canInspect={may("inspect")}
        />
      </Suspense>
      <ZonePlanLinks siteId={site.id} zones={zones} title="See the members on a zone plan" />
      <CautionNotice compact />
    </div>
  );
}
