// The printed plan: the plan view's data (same filters as the screen) laid out by lib/pdf/zone-plan.tsx.
import "server-only";
import { formatUtilisation } from "@/lib/client/format";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { renderZonePlanDocument, type ZonePlanPdfData } from "@/lib/pdf/zone-plan";
import type { ZonePlanQuery } from "@/lib/validations/zone-plan";
import { pinState, type PinState } from "./pin-look";
import { zonePlanImage, zonePlanView } from "./index";

type Site = { id: string; organisationId: string; name: string; timezone: string };

function filterText(q: ZonePlanQuery): string | null {
  const parts: string[] = [];
  if (q.status) parts.push(MEMBER_STATUS_LABELS[q.status]);
  if (q.check) parts.push(q.check === "pass" ? "passing" : q.check === "fail" ? "failing" : "not checked");
  if (q.q) parts.push(`tag contains “${q.q}”`);
  return parts.length ? parts.join(", ") : null;
}

export async function renderZonePlanPdf({ site, zone, paper, query }: { site: Site; zone: { id: string; name: string }; paper: "a3" | "a4"; query: ZonePlanQuery }) {
  const [view, image] = await Promise.all([zonePlanView({ site, zone, query }), zonePlanImage({ site, zone })]);
  const counts: Partial<Record<PinState, number>> = {};
  const pins = view.pins.map((p) => {
    const state = pinState(p);
    counts[state] = (counts[state] ?? 0) + 1;
    return { tag: p.tag, x: p.x, y: p.y, state, utilisation: formatUtilisation(p.utilisation) };
  });
  for (const m of view.unpinned) {
    const state = pinState(m);
    counts[state] = (counts[state] ?? 0) + 1;
  }
  const sc = view.scale;
  const data: ZonePlanPdfData = {
    siteName: site.name,
    zoneName: view.zoneName,
    generatedAt: new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: site.timezone }).format(new Date()),
    filterText: filterText(query),
    image: image ? { data: image.bytes, format: image.png ? "png" : "jpg", width: image.width, height: image.height } : null,
    scale: sc && view.width && view.height ? { distanceMm: sc.distanceMm, imagePx: Math.hypot((sc.x2 - sc.x1) * view.width, (sc.y2 - sc.y1) * view.height) } : null,
    pins,
    unpinned: view.unpinned.map((m) => ({ tag: m.tag, word: m.word, utilisation: formatUtilisation(m.utilisation) })),
    counts,
  };
  return renderZonePlanDocument(data, paper);
}
