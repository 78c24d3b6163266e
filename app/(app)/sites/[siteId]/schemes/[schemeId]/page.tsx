import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Forbidden } from "@/components/forbidden";
import { listSchemeDocuments } from "@/db/queries/scheme-documents";
import { getScheme } from "@/db/queries/schemes";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { presignGet } from "@/lib/storage";
import { BackpropLevels } from "../backprop-levels";
import { SchemeFiles } from "../scheme-files";
import { SchemeForm } from "../scheme-form";

export const metadata: Metadata = { title: "Scheme" };

export default async function SchemePage({ params }: { params: Promise<{ siteId: string; schemeId: string }> }) {
  const { siteId, schemeId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageSchemes")) return <Forbidden what="Schemes are published by temporary works designers and coordinators." />;
  if (!isUuid(schemeId)) notFound();
  const s = await getScheme({ siteId: site.id, schemeId });
  if (!s) notFound();
  const [drawingUrl, certificateUrl] = await Promise.all([
    s.drawingKey ? presignGet(s.drawingKey, 3600, `${s.reference}-drawing`) : null,
    s.certificateKey ? presignGet(s.certificateKey, 3600, `${s.reference}-check-certificate`) : null,
  ]);
  const documents = (await listSchemeDocuments({ schemeId: s.id })).map((d) => ({
    id: d.id,
    kind: d.kind,
    drawingNumber: d.drawingNumber,
    revision: d.revision,
    checkerName: d.checkerName,
    checkCategory: d.checkCategory,
    documentDate: d.documentDate,
    uploadedByName: d.uploadedByName,
    current: d.objectKey === s.drawingKey || d.objectKey === s.certificateKey,
  }));
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <h1 className="text-2xl font-bold">{s.reference} — {s.title}</h1>
      <SchemeFiles siteId={site.id} schemeId={s.id} drawingUrl={drawingUrl} certificateUrl={certificateUrl} category={s.category} documents={documents} canEdit />
      <BackpropLevels scheme={s} unitSystem={site.unitSystem} />
      <SchemeForm
        siteId={site.id}
        unitSystem={site.unitSystem}
        existing={{ ...s, validFrom: s.validFrom?.toISOString() ?? null, validUntil: s.validUntil?.toISOString() ?? null }}
      />
    </div>
  );
}
