import { formatDate } from "@/lib/format-date";
import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { ButtonLink } from "@/components/ui/button";
import { listSchemes } from "@/db/queries/schemes";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { formatForce } from "@/lib/units";
import { ZonesPanel } from "./zones-panel";

export const metadata: Metadata = { title: "Schemes and zones" };

export default async function SchemesPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageSchemes") && !may("manageZones")) return <Forbidden what="Schemes and zones are kept by temporary works designers and coordinators." />;
  const [schemes, zones] = await Promise.all([listSchemes({ siteId: site.id }), listZones({ siteId: site.id })]);
  const now = Date.now();
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-2xl font-bold">Schemes and zones</h1>
        {may("manageSchemes") ? (
          <ButtonLink href={`/sites/${site.id}/schemes/new`}>
            <Icon name="add" /> New scheme
          </ButtonLink>
        ) : null}
      </div>
      <section aria-labelledby="schemes-h">
        <h2 id="schemes-h" className="mb-2 text-lg font-bold">Schemes</h2>
        <ul className="flex flex-col gap-2">
          {schemes.map((s) => {
            const expired = s.validUntil != null && s.validUntil.getTime() < now;
            return (
              <li key={s.id}>
                <Link href={`/sites/${site.id}/schemes/${s.id}`} className="flex min-h-touch flex-wrap items-center justify-between gap-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-3 hover:border-brand">
                  <span>
                    <span className="block font-semibold">{s.reference} — {s.title}</span>
                    <span className="text-sm text-ink-soft">
                      Category {s.category} · {s.designerName}
                      {s.designLoadN != null ? ` · ${formatForce(s.designLoadN)} per member` : ""} · {s.memberCount} member{s.memberCount === 1 ? "" : "s"}
                    </span>
                  </span>
                  <span className={`flex items-center gap-1 text-sm font-semibold ${expired ? "text-bad" : "text-ok"}`}>
                    <Icon name={expired ? "bad" : "ok"} className="h-4 w-4" />
                    {s.validUntil ? `${expired ? "Expired" : "Valid until"} ${formatDate(s.validUntil, site.timezone)}` : "No end date"}
                  </span>
                </Link>
              </li>
            );
          })}
          {schemes.length === 0 ? <li className="text-ink-soft">No schemes yet.</li> : null}
        </ul>
      </section>
      <ZonesPanel siteId={site.id} zones={zones} canEdit={may("manageZones")} />
    </div>
  );
}
