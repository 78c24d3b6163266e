// QR tag labels for members: 21 per A4 sheet (3 × 7 labels of 63.5 × 38.1 mm, a common self-adhesive
// layout). Each QR code opens the member's page; it is drawn as vector squares so it prints sharp.
import { Document, Page, Path, StyleSheet, Svg, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { qrPath } from "./qr";
import { CAUTION_TEXT } from "@/lib/caution";
import { PDF_FONT_FAMILY, registerPdfFonts } from "./fonts";

export type LabelMember = { id: string; tag: string; typeName: string; zoneName: string | null };

const MM = 72 / 25.4;
const LABEL_W = 63.5 * MM;
const LABEL_H = 38.1 * MM;
const PITCH_X = 66.04 * MM;
const MARGIN_LEFT = 7.21 * MM;
const MARGIN_TOP = 15.15 * MM;
const COLS = 3;
const ROWS = 7;
export const LABELS_PER_SHEET = COLS * ROWS;
const QR_SIZE = 31 * MM;

const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT_FAMILY, color: "#000000", paddingTop: MARGIN_TOP, paddingLeft: MARGIN_LEFT, paddingBottom: 0 },
  grid: { flexDirection: "row", flexWrap: "wrap", width: PITCH_X * (COLS - 1) + LABEL_W },
  label: { width: LABEL_W, height: LABEL_H, flexDirection: "row", alignItems: "center", padding: 2.5 * MM },
  gap: { width: PITCH_X - LABEL_W, height: LABEL_H },
  text: { flex: 1, paddingLeft: 2.5 * MM, justifyContent: "center" },
  tag: { fontWeight: 700, lineHeight: 1.1 },
  type: { fontSize: 6.5, marginTop: 3, lineHeight: 1.2, maxLines: 3 },
  zone: { fontSize: 6.5, marginTop: 2, lineHeight: 1.2, maxLines: 2 },
  site: { fontSize: 5.5, marginTop: 2, color: "#333333" },
  footer: { position: "absolute", left: MARGIN_LEFT, right: MARGIN_LEFT, bottom: 4 * MM, fontSize: 5.5, color: "#333333", lineHeight: 1.2 },
});

/** Bigger type for short tags; a long tag still fits on the label in two lines at most. */
function tagSize(tag: string) {
  if (tag.length <= 9) return 17;
  if (tag.length <= 13) return 13;
  if (tag.length <= 20) return 10;
  return 8;
}

export function memberUrl(appUrl: string, siteId: string, memberId: string) {
  return `${appUrl.replace(/\/+$/, "")}/sites/${siteId}/members/${memberId}`;
}

function Label({ m, siteId, siteLabel, appUrl }: { m: LabelMember; siteId: string; siteLabel: string; appUrl: string }) {
  const qr = qrPath(memberUrl(appUrl, siteId, m.id));
  return (
    <View style={s.label} wrap={false}>
      <Svg width={QR_SIZE} height={QR_SIZE} viewBox={`0 0 ${qr.size} ${qr.size}`}>
        <Path d={qr.d} fill="#000000" />
      </Svg>
      <View style={s.text}>
        <Text style={[s.tag, { fontSize: tagSize(m.tag) }]}>{m.tag}</Text>
        <Text style={s.type}>{m.typeName}</Text>
        {m.zoneName ? <Text style={s.zone}>{m.zoneName}</Text> : null}
        <Text style={s.site}>{siteLabel}</Text>
      </View>
    </View>
  );
}

export function LabelSheet({
  members, siteId, siteName, siteCode, appUrl,
}: { members: LabelMember[]; siteId: string; siteName: string; siteCode: string; appUrl: string }) {
  const pages: LabelMember[][] = [];
  for (let i = 0; i < members.length; i += LABELS_PER_SHEET) pages.push(members.slice(i, i + LABELS_PER_SHEET));
  const siteLabel = `${siteCode} · ${siteName}`;
  return (
    <Document title={`Member labels — ${siteName}`} author="Strutwise" subject="QR tag labels" creator="Strutwise">
      {pages.map((page, p) => (
        <Page key={p} size="A4" style={s.page}>
          <View style={s.grid}>
            {page.map((m, i) => (
              <View key={m.id} style={{ flexDirection: "row" }}>
                <Label m={m} siteId={siteId} siteLabel={siteLabel} appUrl={appUrl} />
                {i % COLS !== COLS - 1 ? <View style={s.gap} /> : null}
              </View>
            ))}
          </View>
          <Text style={s.footer} fixed>
            {`Scan a label to open the member's record (sign-in needed). ${CAUTION_TEXT}  Sheet ${p + 1} of ${pages.length}.`}
          </Text>
        </Page>
      ))}
    </Document>
  );
}

export async function renderLabelSheet(args: Parameters<typeof LabelSheet>[0]): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<LabelSheet {...args} />);
}
