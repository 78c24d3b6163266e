import { Icon } from "@/components/icons";
import type { Metadata } from "next";
import { Suspense } from "react";
import { CautionNotice } from "@/components/caution-notice";
import { ZonePlanLinks } from "@/components/plan/zone-plan-links";
import { getSiteCounts } from "@/db/queries/sites";
import { listZonesWithPlan } from "@/db/queries/zone-plans";
import { loadSitePage } from "@/lib/auth/site-page";
import { MEMBER_STATUS_LABELS, PERMIT_STATUS_LABELS } from "@/lib/labels";
import { ROLE_LABELS } from "@/lib/permissions";
import { OverloadSummary } from "./alerts/overload-summary";
import { PermitsAwaitingReview } from "./permits/review-link";

export const metadata: Metadata = { title: "Site overview" };

async function Counts({ siteId }: { siteId: string }) {
  const counts = await getSiteCounts({ siteId });
  const memberTotal = Object.values(counts.members).reduce((a, b) => a + b, 0);
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <section aria-labelledby="members-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="members-h" className="mb-3 text-lg font-bold">
          Members <span className="tabular text-ink-soft">({memberTotal})</span>
        </h2>
        <dl className="grid grid-cols-2 gap-2">
          {Object.entries(MEMBER_STATUS_LABELS).map(([status, label]) => (
            <div key={status} className="rounded-lg bg-paper-sunk p-3" data-testid={`member-count-${status}`}>
              <dt className="text-sm">{label}</dt>
              <dd className="tabular text-2xl font-bold">{counts.members[status] ?? 0}</dd>
            </div>
          ))}
        </dl>
        {counts.failing > 0 ? (
          <p role="status" className="mt-3 flex items-center gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
            <Icon name="bad" className="h-5 w-5 shrink-0" /> {counts.failing} member{counts.failing === 1 ? "" : "s"} failing the capacity check
          </p>
        ) : (
          <p className="mt-3 flex items-center gap-2 rounded-lg bg-ok-soft p-3 font-semibold text-ok">
            <Icon name="ok" className="h-5 w-5 shrink-0" /> No member is failing its capacity check
          </p>
        )}
      </section>
      <section aria-labelledby="permits-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="permits-h" className="mb-3 text-lg font-bold">
          Permits
        </h2>
        <dl className="grid grid-cols-2 gap-2">
          {Object.entries(PERMIT_STATUS_LABELS).map(([status, label]) => (
            <div key={status} className="rounded-lg bg-paper-sunk p-3" data-testid={`permit-count-${status}`}>
              <dt className="text-sm">{label}</dt>
              <dd className="tabular text-2xl font-bold">{counts.permits[status] ?? 0}</dd>
            </div>
          ))}
        </dl>
      </section>
    </div>
  );
}

export default async function SiteOverviewPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, roles, user, may } = await loadSitePage(siteId);
  const zones = await listZonesWithPlan({ siteId: site.id });
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">{site.name}</h1>
        <p className="text-ink-soft">
          {site.code}
          {site.address ? ` · ${site.address}` : ""} · You are: {roles.map((r) => ROLE_LABELS[r]).join(", ")}
        </p>
      </div>
      {may("issuePermit") ? (
        <Suspense fallback={null}>
          <PermitsAwaitingReview siteId={site.id} />
        </Suspense>
      ) : null}
      <Suspense fallback={<p className="text-ink-soft">Looking for overloaded members…</p>}>
        <OverloadSummary siteId={site.id} userId={user.id} />
      </Suspense>
      <Suspense fallback={<p className="text-ink-soft">Counting members and permits…</p>}>
        <Counts siteId={site.id} />
      </Suspense>
      <ZonePlanLinks siteId={site.id} zones={zones} />
      <CautionNotice />
    </div>
  );
}
