import type { Metadata } from "next";
import Link from "next/link";
import { CautionNotice } from "@/components/caution-notice";
import { Forbidden } from "@/components/forbidden";
import { listPermitCandidates } from "@/db/queries/permits";
import { listSchemes } from "@/db/queries/schemes";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { fmtUtilisation } from "@/lib/permits/format";
import { permitNumberLabel } from "@/lib/validations/permit";
import { RequestForm, type Candidate } from "./request-form";

export const metadata: Metadata = { title: "Request a permit" };

export default async function NewPermitPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("requestPermit")) return <Forbidden what="Requesting permits is for site engineers, supervisors and the coordinator." />;
  const [rows, schemes, zones] = await Promise.all([
    listPermitCandidates({ siteId: site.id, statuses: ["draft", "submitted", "loaded", "out_of_service"] }),
    listSchemes({ siteId: site.id }),
    listZones({ siteId: site.id }),
  ]);
  const now = Date.now();
  const candidates: Candidate[] = rows.map((m) => ({
    id: m.id,
    tag: m.tag,
    status: m.status,
    zoneId: m.zoneId,
    zoneName: m.zoneName,
    schemeId: m.schemeId,
    schemeReference: m.schemeReference,
    utilisationText: m.utilisation == null ? "not checked" : `${fmtUtilisation(m.utilisation)} utilisation`,
    checkPass: m.checkPass,
    // The same rules the server applies, so the phone says why before sending.
    blockedForLoad:
      m.coveredBy?.kind === "load"
        ? `Already loaded under ${permitNumberLabel("load", m.coveredBy.number)}`
        : m.checkPass === false
          ? `Fails its check (${m.utilisation == null ? "check incomplete" : `${fmtUtilisation(m.utilisation)} utilisation`})`
          : m.checkPass == null
            ? "Not checked yet"
            : null,
    blockedForStrike: m.coveredBy?.kind === "strike" ? `Already released under ${permitNumberLabel("strike", m.coveredBy.number)}` : null,
    readyPhotos: m.readyPhotos,
    inspectionOk: !!m.latestInspection && m.latestInspection.result === "pass" && !!m.latestInspection.nextDueAt && new Date(m.latestInspection.nextDueAt).getTime() > now,
  }));
  return (
    <div className="mx-auto flex w-full max-w-2xl flex-col gap-4">
      <div>
        <Link href={`/sites/${site.id}/permits`} className="inline-flex min-h-touch items-center text-brand underline-offset-4 hover:underline">
          ← Permits
        </Link>
        <h1 className="text-2xl font-bold">Request a permit</h1>
        <p className="text-ink-soft">The coordinator reviews every member in scope before issuing.</p>
      </div>
      <RequestForm
        siteId={site.id}
        candidates={candidates}
        schemes={schemes.map((s) => ({ id: s.id, label: `${s.reference} — ${s.title}` }))}
        zones={zones.map((z) => ({ id: z.id, label: z.name }))}
      />
      <CautionNotice compact />
    </div>
  );
}
