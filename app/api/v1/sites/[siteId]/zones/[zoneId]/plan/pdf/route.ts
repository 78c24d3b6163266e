// The zone's plan with its pins and a legend, on A3 (default) or A4, for the site office wall.
import { siteRoute } from "@/lib/api/route";
import { renderZonePlanPdf } from "@/lib/zone-plans/pdf";
import { zonePlanPdfQuerySchema } from "@/lib/validations/zone-plan";

export const GET = siteRoute({ resource: "zone", permission: "viewSite", query: zonePlanPdfQuerySchema }, async ({ site, resource: zone, query }) => {
  const { paper, ...filters } = query;
  const pdf = await renderZonePlanPdf({ site, zone, paper, query: filters });
  const name = `${zone.name.replace(/[^A-Za-z0-9 _-]+/g, "").trim().replace(/\s+/g, "-") || "zone"}-plan-${paper}.pdf`;
  return new Response(new Uint8Array(pdf), {
    headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${name}"`, "cache-control": "private, no-store" },
  });
});
