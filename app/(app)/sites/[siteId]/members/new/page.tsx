import type { Metadata } from "next";
import { CautionNotice } from "@/components/caution-notice";
import { Forbidden } from "@/components/forbidden";
import { listMemberTypes } from "@/db/queries/member-types";
import { listSchemes } from "@/db/queries/schemes";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { LogMemberForm } from "./log-member-form";

export const metadata: Metadata = { title: "Log a member" };

export default async function LogMemberPage({ params, searchParams }: { params: Promise<{ siteId: string }>; searchParams: Promise<{ tag?: string | string[] }> }) {
  const { siteId } = await params;
  const { tag } = await searchParams;
  const { site, may } = await loadSitePage(siteId);
  if (!may("logMember")) return <Forbidden what="Logging members is for site engineers, supervisors and coordinators." />;
  const [zones, schemes, types] = await Promise.all([
    listZones({ siteId: site.id }),
    listSchemes({ siteId: site.id }),
    listMemberTypes({ organisationId: site.organisationId }),
  ]);
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Log a member</h1>
      <LogMemberForm
        siteId={site.id}
        unitSystem={site.unitSystem}
        prefillTag={typeof tag === "string" ? tag.slice(0, 40) : ""}
        zones={zones.map((z) => ({ id: z.id, name: z.name }))}
        schemes={schemes.map((s) => ({
          id: s.id, reference: s.reference, title: s.title, slabThicknessMm: s.slabThicknessMm, concreteDensityKnM3: s.concreteDensityKnM3,
          formworkKnM2: s.formworkKnM2, constructionKnM2: s.constructionKnM2, backprop: s.backprop, designSpacingXMm: s.designSpacingXMm, designSpacingYMm: s.designSpacingYMm,
        }))}
        types={types.map((t) => ({ id: t.id, name: t.name, kind: t.kind, minExtensionMm: t.minExtensionMm, maxExtensionMm: t.maxExtensionMm }))}
        // The library and slab data with the page: a copy kept for a round checks a member with no signal.
        offline={{
          site: { designCode: site.designCode, unitSystem: site.unitSystem },
          types: types.map((t) => ({ id: t.id, kind: t.kind, params: t.params as Record<string, unknown>, minExtensionMm: t.minExtensionMm, maxExtensionMm: t.maxExtensionMm })),
          schemes: schemes.map((s) => ({
            id: s.id, reference: s.reference, slabThicknessMm: s.slabThicknessMm, concreteDensityKnM3: s.concreteDensityKnM3, formworkKnM2: s.formworkKnM2, constructionKnM2: s.constructionKnM2,
            backprop: s.backprop,
          })),
        }}
      />
      <CautionNotice compact />
    </div>
  );
}
