import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { listSiteRoleEmails } from "@/db/queries/memberships";
import { listDelegations } from "@/db/queries/permits";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { formatDateTime } from "@/lib/format-date";
import type { UnitSystem } from "@/lib/permits/format";
import { DelegationForm, RevokeButton } from "./delegation-form";

export const metadata: Metadata = { title: "Supervisors' issuing scope" };

export default async function DelegationsPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("delegatePermits")) return <Forbidden what="Giving supervisors issuing scope is for the temporary works coordinator." />;
  const [rows, supervisors, zones] = await Promise.all([
    listDelegations({ siteId: site.id }),
    listSiteRoleEmails({ siteId: site.id, role: "supervisor" }),
    listZones({ siteId: site.id }),
  ]);
  const zoneName = new Map(zones.map((z) => [z.id, z.name]));
  const units = site.unitSystem as UnitSystem;
  const now = Date.now();
  return (
    <div className="mx-auto flex w-full max-w-4xl flex-col gap-4">
      <div>
        <Link href={`/sites/${site.id}/permits`} className="inline-flex min-h-touch items-center text-brand underline-offset-4 hover:underline">
          ← Permits
        </Link>
        <h1 className="text-2xl font-bold">Supervisors&apos; issuing scope</h1>
        <p className="text-ink-soft">A supervisor with scope may issue, refuse, withdraw and close permits whose members are all in their zones, until the date you set.</p>
      </div>
      <DelegationForm siteId={site.id} supervisors={supervisors.map((s) => ({ id: s.userId, name: s.name }))} zones={zones.map((z) => ({ id: z.id, name: z.name }))} />
      <section aria-labelledby="given-h" className="flex flex-col gap-2">
        <h2 id="given-h" className="text-xl font-bold">
          Given so far
        </h2>
        {rows.length === 0 ? <p className="text-ink-soft">No supervisor has issuing scope on this site.</p> : null}
        <ul className="flex flex-col gap-2">
          {rows.map((r) => {
            const active = !r.revokedAt && r.validUntil.getTime() > now;
            return (
              <li key={r.id} className="flex flex-wrap items-start justify-between gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-3">
                <div>
                  <p className="font-bold">{r.userName}</p>
                  <p>{r.zoneIds.map((z) => zoneName.get(z) ?? "a removed zone").join(", ")}</p>
                  <p className="text-sm text-ink-soft">
                    Until {formatDateTime(r.validUntil, site.timezone)} · given by {r.grantedByName} on {formatDateTime(r.createdAt, site.timezone)}
                    {r.revokedAt ? ` · revoked ${formatDateTime(r.revokedAt, site.timezone)}` : ""}
                  </p>
                  <p className={`mt-1 inline-flex items-center gap-1 text-sm font-semibold ${active ? "text-ok" : "text-ink-soft"}`}>
                    <Icon name={active ? "ok" : "bad"} className="h-4 w-4" /> {active ? "In force" : r.revokedAt ? "Revoked" : "Expired"}
                  </p>
                </div>
                {active ? <RevokeButton delegationId={r.id} /> : null}
              </li>
            );
          })}
        </ul>
      </section>
    </div>
  );
}
