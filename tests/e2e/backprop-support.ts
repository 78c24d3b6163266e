// A back-propped scheme of its own for each run (through the API), on the demo wharf site:
// 250 mm slab at 25 kN/m³ (w = 6.25 kN/m²), two levels of props, 0.5 kN/m² formwork and
// 1.5 kN/m² construction load at casting.
import { expect, type Page } from "@playwright/test";
import { WHARF } from "../support/demo";

export async function backproppedScheme(page: Page, reference: string) {
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const site = sites.items.find((s) => s.name === WHARF)!;
  const created = await page.request.post(`/api/v1/sites/${site.id}/schemes`, {
    data: {
      reference, title: "Back-propping under the next pour", designerName: "E2E Designer", category: 1,
      slabThicknessMm: 250, concreteDensityKnM3: 25, backprop: { shoredLevels: 2, formworkKPa: 0.5, constructionKPa: 1.5 },
    },
  });
  expect(created.status()).toBe(201);
  const { scheme } = (await created.json()) as { scheme: { id: string } };
  const types = (await (await page.request.get(`/api/v1/sites/${site.id}/member-types`)).json()) as { items: { id: string; name: string }[] };
  const propD = types.items.find((t) => t.name.startsWith("EN 1065 class D prop"))!;
  return { siteId: site.id, schemeId: scheme.id, propDId: propD.id, propDName: propD.name };
}
