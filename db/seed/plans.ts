// Demo zone plans: our own generated drawings (grid lines labelled from the zone's grid, bays,
// a slab edge and a title block), never a real drawing, stored like an upload would be; then the
// zone's members are placed on their bays. One member per larger zone is left off the plan so the
// "not on the plan" list has something in it.
import { asc, eq } from "drizzle-orm";
import sharp from "sharp";
import * as schema from "@/db/schema";
import type { Tx } from "@/db";
import { putObject } from "@/lib/storage";
import { processPlan } from "@/lib/zone-plans/process";

/** Members left off their zone's plan in the demo (listed beside it instead). */
export const DEMO_OFF_PLAN = ["WXW-L1-P12", "ORB-TP-03"] as const;

const W = 2400;
const H = 1600;
const M = 220;

function escapeXml(s: string) {
  return s.replace(/[<>&"']/g, (c) => ({ "<": "&lt;", ">": "&gt;", "&": "&amp;", '"': "&quot;", "'": "&apos;" })[c]!);
}

/** "A–D" → A, B, C, D; "5–7" → 5, 6, 7; "C" → C. */
function expand(part: string): string[] {
  const [a, b] = part.split(/[–-]/).map((x) => x.trim());
  if (!a) return [];
  if (!b) return [a];
  if (/^\d+$/.test(a) && /^\d+$/.test(b)) {
    const out: string[] = [];
    for (let i = Number(a); i <= Number(b); i++) out.push(String(i));
    return out;
  }
  const out: string[] = [];
  for (let c = a.charCodeAt(0); c <= b.charCodeAt(0); c++) out.push(String.fromCharCode(c));
  return out;
}

/** Grid lines across and down from a zone's grid text ("A–D / 1–4"); at least two of each, so there is a bay. */
export function gridLines(grid: string | null): { across: string[]; down: string[] } {
  const [p1, p2] = (grid ?? "A–C / 1–3").split("/").map((x) => x.trim());
  let across = expand(p1 ?? "A–C");
  let down = expand(p2 ?? "1–3");
  const next = (labels: string[]) => {
    const last = labels.at(-1) ?? "A";
    return /^\d+$/.test(last) ? String(Number(last) + 1) : String.fromCharCode(last.charCodeAt(0) + 1);
  };
  while (across.length < 2) across = [...across, next(across)];
  while (down.length < 2) down = [...down, next(down)];
  return { across, down };
}

export function demoPlanSvg(zone: { name: string; level: string | null; grid: string | null }): string {
  const { across, down } = gridLines(zone.grid);
  const xs = across.map((_, i) => M + (i * (W - 2 * M)) / (across.length - 1));
  const ys = down.map((_, i) => M + (i * (H - 2 * M - 140)) / (down.length - 1));
  const lines = [
    ...xs.map((x, i) => `<line x1="${x}" y1="${M - 90}" x2="${x}" y2="${ys.at(-1)! + 90}" stroke="#6b7280" stroke-width="3" stroke-dasharray="40 12 8 12"/>
      <circle cx="${x}" cy="${M - 130}" r="38" fill="#fff" stroke="#111" stroke-width="4"/>
      <text x="${x}" y="${M - 116}" font-family="sans-serif" font-size="40" font-weight="700" text-anchor="middle">${escapeXml(across[i]!)}</text>`),
    ...ys.map((y, i) => `<line x1="${M - 90}" y1="${y}" x2="${xs.at(-1)! + 90}" y2="${y}" stroke="#6b7280" stroke-width="3" stroke-dasharray="40 12 8 12"/>
      <circle cx="${M - 130}" cy="${y}" r="38" fill="#fff" stroke="#111" stroke-width="4"/>
      <text x="${M - 130}" y="${y + 14}" font-family="sans-serif" font-size="40" font-weight="700" text-anchor="middle">${escapeXml(down[i]!)}</text>`),
  ];
  const columns = xs.flatMap((x) => ys.map((y) => `<rect x="${x - 22}" y="${y - 22}" width="44" height="44" fill="#374151"/>`));
  const bays: string[] = [];
  for (let i = 0; i < xs.length - 1; i++)
    for (let j = 0; j < ys.length - 1; j++) {
      const cx = (xs[i]! + xs[i + 1]!) / 2;
      const cy = (ys[j]! + ys[j + 1]!) / 2;
      bays.push(`<text x="${cx}" y="${cy}" font-family="sans-serif" font-size="30" fill="#9ca3af" text-anchor="middle">bay ${escapeXml(across[i]!)}${escapeXml(down[j]!)}–${escapeXml(across[i + 1]!)}${escapeXml(down[j + 1]!)}</text>`);
    }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}">
    <rect width="${W}" height="${H}" fill="#ffffff"/>
    <rect x="${M - 60}" y="${M - 60}" width="${xs.at(-1)! - xs[0]! + 120}" height="${ys.at(-1)! - ys[0]! + 120}" fill="#f3f4f6" stroke="#111" stroke-width="8"/>
    ${lines.join("")}
    ${columns.join("")}
    ${bays.join("")}
    <rect x="${W - 900}" y="${H - 150}" width="860" height="120" fill="#fff" stroke="#111" stroke-width="4"/>
    <text x="${W - 880}" y="${H - 100}" font-family="sans-serif" font-size="40" font-weight="700">${escapeXml(zone.name)}</text>
    <text x="${W - 880}" y="${H - 52}" font-family="sans-serif" font-size="28">${escapeXml(zone.level ? `Level ${zone.level} · ` : "")}demo plan — generated, not to scale</text>
  </svg>`;
}

/** Places n members on a lattice inside the grid (fractions of the image), bay by bay. */
export function demoPlaces(n: number, grid: string | null): { x: number; y: number }[] {
  const { across, down } = gridLines(grid);
  const x0 = M / W;
  const x1 = (W - M) / W;
  const y0 = M / H;
  const y1 = (H - M - 140) / H;
  const cols = Math.max(across.length, Math.ceil(Math.sqrt(n * 1.6)));
  const rows = Math.ceil(n / cols);
  const out: { x: number; y: number }[] = [];
  for (let i = 0; i < n; i++) {
    const c = i % cols;
    const r = Math.floor(i / cols);
    out.push({ x: Math.round((x0 + ((c + 0.5) * (x1 - x0)) / cols) * 10000) / 10000, y: Math.round((y0 + ((r + 0.5) * (y1 - y0)) / Math.max(rows, 1)) * 10000) / 10000 });
  }
  return out;
}

export async function seedZonePlans(tx: Tx, { uploadedBy, now, leaveOff }: { uploadedBy: string; now: number; leaveOff: readonly string[] }) {
  const zones = await tx.select().from(schema.zones).orderBy(asc(schema.zones.name));
  let placed = 0;
  for (const z of zones) {
    const out = await processPlan(await sharp(Buffer.from(demoPlanSvg(z))).png().toBuffer());
    if (!out.ok) throw new Error(`demo plan for ${z.name}: ${out.reason}`);
    const base = `sites/${z.siteId}/zones/${z.id}/plan-demo`;
    await putObject(`${base}/plan.png`, out.plan.image, "image/png");
    await tx
      .update(schema.zones)
      .set({
        planImageKey: `${base}/plan.png`,
        planSourceKey: `${base}/plan.png`,
        planSourceType: "image/png",
        planWidth: out.plan.width,
        planHeight: out.plan.height,
        planUploadedBy: uploadedBy,
        planUploadedAt: new Date(now - 12 * 86_400_000),
      })
      .where(eq(schema.zones.id, z.id));
    const rows = await tx.select({ id: schema.members.id, tag: schema.members.tag }).from(schema.members).where(eq(schema.members.zoneId, z.id)).orderBy(asc(schema.members.tag));
    const onPlan = rows.filter((m) => !leaveOff.includes(m.tag));
    const places = demoPlaces(onPlan.length, z.grid);
    for (const [i, m] of onPlan.entries()) {
      await tx.update(schema.members).set({ planX: places[i]!.x, planY: places[i]!.y }).where(eq(schema.members.id, m.id));
      placed += 1;
    }
  }
  return { zones: zones.length, placed };
}
