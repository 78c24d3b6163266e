// The permit as a PDF: black on white, readable when photocopied, on A4 or US Letter.
import { Document, Page, Path, StyleSheet, Svg, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { CAUTION_TEXT } from "@/lib/caution";
import { PDF_FONT_FAMILY, registerPdfFonts } from "./fonts";
import { qrPath } from "./qr";

registerPdfFonts();

export type PermitPdfMember = {
  tag: string;
  type: string;
  zone: string;
  extension: string;
  load: string;
  capacity: string;
  utilisation: string;
};

export type PermitPdfData = {
  numberLabel: string;
  kindLabel: string;
  kind: "load" | "strike";
  statusLabel: string;
  siteName: string;
  siteCode: string;
  zones: string[];
  schemes: string[];
  /** "Request 14 by Dana Lee, 3 Dec 2026, 09:30 GMT": the request it was issued from. */
  requestReference: string;
  requestNote: string | null;
  issuedBy: string;
  issuedAt: string;
  validUntil: string;
  conditions: string | null;
  evidence: string | null;
  members: PermitPdfMember[];
  units: { length: string; force: string };
  permitUrl: string;
  generatedAt: string;
};

const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT_FAMILY, fontSize: 9.5, color: "#000000", paddingTop: 36, paddingBottom: 54, paddingHorizontal: 40 },
  body: {},
  header: { flexDirection: "row", justifyContent: "space-between", alignItems: "flex-start", borderBottomWidth: 2, borderBottomColor: "#000", paddingBottom: 10, marginBottom: 12 },
  kind: { fontSize: 20, fontWeight: 700, textTransform: "uppercase", letterSpacing: 0.5, lineHeight: 1.2 },
  number: { fontSize: 26, fontWeight: 700, marginTop: 4, lineHeight: 1.2 },
  status: { fontSize: 11, fontWeight: 700, borderWidth: 1.5, borderColor: "#000", paddingVertical: 3, paddingHorizontal: 8, marginTop: 6, alignSelf: "flex-start" },
  qrBox: { alignItems: "center", width: 110 },
  qr: { width: 96, height: 96 },
  small: { fontSize: 7.5, textAlign: "center" },
  facts: { borderWidth: 1, borderColor: "#000", marginBottom: 12 },
  factRow: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: "#000" },
  factRowLast: { flexDirection: "row" },
  factKey: { width: 120, padding: 5, fontWeight: 700, backgroundColor: "#e6e6e6", borderRightWidth: 0.5, borderRightColor: "#000" },
  factValue: { flex: 1, padding: 5 },
  h2: { fontSize: 11.5, fontWeight: 700, marginBottom: 5, marginTop: 4 },
  table: { borderWidth: 1, borderColor: "#000", marginBottom: 12 },
  tr: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: "#000" },
  th: { padding: 4, fontWeight: 700, backgroundColor: "#e6e6e6" },
  td: { padding: 4 },
  num: { textAlign: "right" },
  box: { borderWidth: 1, borderColor: "#000", padding: 8, marginBottom: 12 },
  caution: { borderWidth: 2, borderColor: "#000", padding: 8, marginTop: 4, flexDirection: "row" },
  cautionLabel: { fontWeight: 700, marginRight: 4 },
  signRow: { flexDirection: "row", gap: 12, marginTop: 6, marginBottom: 12 },
  signBox: { flex: 1, borderWidth: 1, borderColor: "#000", padding: 6, height: 52 },
  // Dynamic (page-number) text disappears when it inherits a line height, so the footer sets none.
  footer: { position: "absolute", bottom: 22, left: 40, right: 40, fontSize: 7.5, borderTopWidth: 0.5, borderTopColor: "#000", paddingTop: 4 },
});

const cols = [
  { key: "tag", label: "Tag", width: "17%", num: false },
  { key: "type", label: "Type", width: "27%", num: false },
  { key: "zone", label: "Zone", width: "18%", num: false },
  { key: "extension", label: "Extension", width: "10%", num: true },
  { key: "load", label: "Working load", width: "10%", num: true },
  { key: "capacity", label: "Capacity", width: "10%", num: true },
  { key: "utilisation", label: "Util.", width: "8%", num: true },
] as const;

function Fact({ k, v, last = false }: { k: string; v: string; last?: boolean }) {
  return (
    <View style={last ? s.factRowLast : s.factRow} wrap={false}>
      <Text style={s.factKey}>{k}</Text>
      {/* The expiry is what people on site look for first. */}
      <Text style={k === "Valid until" ? [s.factValue, { fontWeight: 700 }] : s.factValue}>{v}</Text>
    </View>
  );
}

export function PermitDocument({ data, size }: { data: PermitPdfData; size: "A4" | "LETTER" }) {
  const qr = qrPath(data.permitUrl);
  // One zone is named in the facts above; several get their own column.
  const columns = data.zones.length > 1 ? cols : cols.filter((c) => c.key !== "zone").map((c) => (c.key === "type" ? { ...c, width: "45%" } : c));
  const facts: [string, string][] = [
    ["Site", `${data.siteName} (${data.siteCode})`],
    [data.zones.length > 1 ? "Zones" : "Zone", data.zones.join("; ") || "—"],
    [data.schemes.length > 1 ? "Schemes" : "Scheme", data.schemes.join("; ") || "—"],
    ["Request", data.requestReference],
    ["Issued by", `${data.issuedBy}, ${data.issuedAt}`],
    ["Valid until", data.validUntil],
  ];
  return (
    <Document title={`${data.numberLabel} ${data.kindLabel}`} author="Strutwise" subject={`${data.kindLabel} — ${data.siteName}`}>
      <Page size={size} style={s.page}>
        <Text
          style={s.footer}
          fixed
          render={({ pageNumber, totalPages }) =>
            `${data.numberLabel} · ${data.siteName} (${data.siteCode}) · generated ${data.generatedAt} · page ${pageNumber} of ${totalPages}`
          }
        />
        <View style={s.body}>
        <View style={s.header}>
          <View style={{ flex: 1 }}>
            <Text style={s.kind}>{data.kindLabel}</Text>
            <Text style={s.number}>{data.numberLabel}</Text>
            <Text style={s.status}>{data.statusLabel}</Text>
          </View>
          <View style={s.qrBox}>
            {/* Vector squares: sharp on paper, and no image to encode and decode for every PDF. */}
            <Svg style={s.qr} viewBox={`0 0 ${qr.size} ${qr.size}`}>
              <Path d={qr.d} fill="#000000" />
            </Svg>
            <Text style={s.small}>Scan for the live permit</Text>
          </View>
        </View>

        <View style={s.facts}>
          {facts.map(([k, v], i) => (
            <Fact key={k} k={k} v={v} last={i === facts.length - 1} />
          ))}
        </View>

        {data.kind === "strike" && data.evidence ? (
          <View wrap={false}>
            <Text style={s.h2}>Evidence that the permanent works can carry themselves</Text>
            <View style={s.box}>
              <Text>{data.evidence}</Text>
            </View>
          </View>
        ) : null}

        <Text style={s.h2}>
          Members in scope ({data.members.length}) — extension in {data.units.length}, loads in {data.units.force}
        </Text>
        <View style={s.table}>
          <View style={s.tr} fixed>
            {columns.map((c) => (
              <Text key={c.key} style={[s.th, { width: c.width }, c.num ? s.num : {}]}>
                {c.label}
              </Text>
            ))}
          </View>
          {data.members.map((m) => (
            <View key={m.tag} style={s.tr} wrap={false}>
              {columns.map((c) => (
                <Text key={c.key} style={[s.td, { width: c.width }, c.num ? s.num : {}, c.key === "tag" ? { fontWeight: 700 } : {}]}>
                  {m[c.key]}
                </Text>
              ))}
            </View>
          ))}
        </View>

        <View wrap={false}>
          <Text style={s.h2}>Conditions</Text>
          <View style={s.box}>
            <Text>{data.conditions?.trim() ? data.conditions : "No conditions beyond the design and this permit."}</Text>
          </View>
        </View>

        {data.requestNote ? (
          <View wrap={false}>
            <Text style={s.h2}>Note from the request</Text>
            <View style={s.box}>
              <Text>{data.requestNote}</Text>
            </View>
          </View>
        ) : null}

        <View wrap={false}>
          <Text style={s.h2}>{data.kind === "load" ? "Loading" : "Striking"} done — supervisor&apos;s confirmation</Text>
          <View style={s.signRow}>
            <View style={s.signBox}>
              <Text>Name</Text>
            </View>
            <View style={s.signBox}>
              <Text>Signature</Text>
            </View>
            <View style={s.signBox}>
              <Text>Date and time</Text>
            </View>
          </View>
        </View>

        <View style={s.caution} wrap={false}>
          <Text>
            <Text style={s.cautionLabel}>CAUTION. </Text>
            {CAUTION_TEXT}
          </Text>
        </View>
        <Text style={{ marginTop: 6, fontSize: 8 }}>Online permit: {data.permitUrl}</Text>
        </View>

      </Page>
    </Document>
  );
}

export async function renderPermitPdf(data: PermitPdfData, size: "A4" | "LETTER"): Promise<Buffer> {
  return renderToBuffer(<PermitDocument data={data} size={size} />);
}
