// QR tag labels for members: 21 per A4 sheet (3 × 7 labels of 63.5 × 38.1 mm, a common self-adhesive
// layout). Each QR code opens the member's page; it is drawn as vector squares so it prints sharp.
import { Document, Font, Page, Path, StyleSheet, Svg, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { qrPath } from "./qr";
import { CAUTION_TEXT } from "@/lib/caution";
import { PDF_FONT_FAMILY, registerPdfFonts } from "./fonts";
import { layoutLabelText, type LabelBlock, type Measure } from "./label-text";

export type LabelMember = { id: string; tag: string; typeName: string; zoneName: string | null };

const MM = 72 / 25.4;
/** The sheet's geometry in points (A4, 3 × 7 labels of 63.5 × 38.1 mm): shared with the label test. */
export const LABEL_SHEET = {
  labelW: 63.5 * MM,
  labelH: 38.1 * MM,
  pitchX: 66.04 * MM,
  pitchY: 38.1 * MM,
  marginLeft: 7.21 * MM,
  marginTop: 15.15 * MM,
  cols: 3,
  rows: 7,
};
const G = LABEL_SHEET;
export const LABELS_PER_SHEET = G.cols * G.rows;
const PAD = 2.5 * MM;
const QR_SIZE = 31 * MM;
const TEXT_LEFT = PAD + QR_SIZE + PAD;
const TEXT_W = G.labelW - TEXT_LEFT - PAD;
const TEXT_H = G.labelH - 2 * PAD;
/** Lines are filled to a little less than the box, so the PDF's own line breaking never wraps them again. */
const FILL_W = TEXT_W - 1.5;

const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT_FAMILY, color: "#000000", position: "relative" },
  label: { position: "absolute", width: G.labelW, height: G.labelH, overflow: "hidden" },
  qr: { position: "absolute", left: PAD, top: (G.labelH - QR_SIZE) / 2 },
  text: { position: "absolute", left: TEXT_LEFT, top: PAD, width: TEXT_W, height: TEXT_H, justifyContent: "center" },
  footer: { position: "absolute", left: G.marginLeft, right: G.marginLeft, bottom: 4 * MM, fontSize: 5.5, color: "#333333", lineHeight: 1.2 },
});

export function memberUrl(appUrl: string, siteId: string, memberId: string) {
  return `${appUrl.replace(/\/+$/, "")}/sites/${siteId}/members/${memberId}`;
}

/** Top-left corner (points, from the page's top-left) of cell `index` (0-based, left to right, top to bottom). */
export function cellOrigin(index: number) {
  return { left: G.marginLeft + (index % G.cols) * G.pitchX, top: G.marginTop + Math.floor(index / G.cols) * G.pitchY };
}

type PlacedLabel = { m: LabelMember; cell: number; blocks: LabelBlock[] };

function Label({ label, siteId, appUrl }: { label: PlacedLabel; siteId: string; appUrl: string }) {
  const qr = qrPath(memberUrl(appUrl, siteId, label.m.id));
  const at = cellOrigin(label.cell);
  return (
    <View style={[s.label, { left: at.left, top: at.top }]} wrap={false}>
      <Svg style={s.qr} width={QR_SIZE} height={QR_SIZE} viewBox={`0 0 ${qr.size} ${qr.size}`}>
        <Path d={qr.d} fill="#000000" />
      </Svg>
      <View style={s.text}>
        {label.blocks.map((b, i) => (
          <Text
            key={i}
            style={{ marginTop: b.gapBefore, fontSize: b.size, lineHeight: b.lineHeight, fontWeight: i === 0 ? 700 : 400, color: i === label.blocks.length - 1 ? "#333333" : "#000000" }}
          >
            {b.lines.join("\n")}
          </Text>
        ))}
      </View>
    </View>
  );
}

/**
 * The sheets: labels fill the cells in order from `start` (1–21, on a part-used first sheet the
 * cells before it stay empty); each later sheet starts at its first cell.
 */
function LabelSheet({ sheets, siteId, siteName, appUrl }: { sheets: PlacedLabel[][]; siteId: string; siteName: string; appUrl: string }) {
  return (
    <Document title={`Member labels — ${siteName}`} author="Strutwise" subject="QR tag labels" creator="Strutwise">
      {sheets.map((sheet, p) => (
        <Page key={p} size="A4" style={s.page}>
          {sheet.map((label) => (
            <Label key={label.m.id} label={label} siteId={siteId} appUrl={appUrl} />
          ))}
          <Text style={s.footer} fixed>
            {`Scan a label to open the member's record (sign-in needed). ${CAUTION_TEXT}  Sheet ${p + 1} of ${sheets.length}.`}
          </Text>
        </Page>
      ))}
    </Document>
  );
}

/** Width of a string in the registered PDF font, with the same shaping (kerning) the PDF uses. */
async function measurer(fontWeight: 400 | 700): Promise<Measure> {
  const source = Font.getFont({ fontFamily: PDF_FONT_FAMILY, fontWeight });
  await source.load();
  const font = source.data;
  if (!font) throw new Error(`The PDF font ${PDF_FONT_FAMILY} ${fontWeight} did not load`);
  const cache = new Map<string, number>();
  return (text, size) => {
    let units = cache.get(text);
    if (units === undefined) {
      const advance = font.layout(text).advanceWidth;
      if (typeof advance !== "number" || !Number.isFinite(advance)) throw new Error(`The PDF font gave no width for a label's text`);
      units = advance;
      cache.set(text, units);
    }
    return (units / font.unitsPerEm) * size;
  };
}

export async function renderLabelSheet({
  members, siteId, siteName, siteCode, appUrl, start = 1,
}: { members: LabelMember[]; siteId: string; siteName: string; siteCode: string; appUrl: string; start?: number }): Promise<Buffer> {
  registerPdfFonts();
  const [measure, measureBold] = await Promise.all([measurer(400), measurer(700)]);
  const siteLabel = `${siteCode} · ${siteName}`;
  const sheets: PlacedLabel[][] = [];
  members.forEach((m, i) => {
    const slot = start - 1 + i;
    const sheet = Math.floor(slot / LABELS_PER_SHEET);
    (sheets[sheet] ??= []).push({
      m,
      cell: slot % LABELS_PER_SHEET,
      blocks: layoutLabelText({ ...m, siteLabel }, { width: FILL_W, height: TEXT_H, measure, measureBold }),
    });
  });
  return renderToBuffer(<LabelSheet sheets={sheets} siteId={siteId} siteName={siteName} appUrl={appUrl} />);
}
