// A zone's plan for the site office wall: the plan with every pin (icon, tag and word as well as
// colour, so a black-and-white copy still reads), a legend, the members not placed, and the caution.
import { Document, Image, Page, Path, Circle, StyleSheet, Svg, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { CAUTION_TEXT } from "@/lib/caution";
import { lookOf, PIN_STATES, type PinState } from "@/lib/zone-plans/pin-look";
import { PDF_FONT_FAMILY, registerPdfFonts } from "./fonts";

registerPdfFonts();

export type ZonePlanPdfData = {
  siteName: string;
  zoneName: string;
  generatedAt: string;
  filterText: string | null;
  image: { data: Buffer; format: "png" | "jpg"; width: number; height: number } | null;
  /** The real distance between the plan's two scale points and their distance in image pixels. */
  scale: { distanceMm: number; imagePx: number } | null;
  pins: { tag: string; x: number; y: number; state: PinState; utilisation: string }[];
  unpinned: { tag: string; word: string; utilisation: string }[];
  counts: Partial<Record<PinState, number>>;
};

const PAPER = { a3: { width: 1190.55, height: 841.89 }, a4: { width: 841.89, height: 595.28 } } as const;
const MARGIN = 28;
const SIDE = 190;

const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT_FAMILY, fontSize: 8, color: "#000", padding: MARGIN },
  header: { flexDirection: "row", justifyContent: "space-between", borderBottomWidth: 1.5, borderBottomColor: "#000", paddingBottom: 5, marginBottom: 8 },
  title: { fontSize: 15, fontWeight: 700 },
  sub: { fontSize: 8.5 },
  row: { flexDirection: "row", flexGrow: 1 },
  side: { width: SIDE, marginLeft: 10 },
  h2: { fontSize: 9.5, fontWeight: 700, marginBottom: 4, marginTop: 2 },
  legendRow: { flexDirection: "row", alignItems: "flex-start", marginBottom: 4 },
  legendText: { flex: 1, marginLeft: 4 },
  caution: { borderWidth: 1.5, borderColor: "#000", padding: 5, marginTop: 6, fontSize: 7.5 },
  label: { position: "absolute", fontSize: 6, fontWeight: 700, backgroundColor: "#ffffff", paddingHorizontal: 1 },
  empty: { borderWidth: 1, borderColor: "#000", padding: 20, textAlign: "center" },
});

function PinIcon({ state, size }: { state: PinState; size: number }) {
  const look = lookOf(state);
  return (
    <Svg width={size} height={size} viewBox="-1.2 -1.2 2.4 2.4">
      <Circle cx={0} cy={0} r={1} fill={look.colour} stroke="#000000" strokeWidth={0.15} />
      <Path d={look.glyph} stroke="#ffffff" strokeWidth={0.28} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

/** 1:N on paper: the scale points' real distance over their printed distance (pt → mm), rounded to 2 figures. */
function printScale(sc: { distanceMm: number; imagePx: number }, k: number) {
  const printedMm = (sc.imagePx * k * 25.4) / 72;
  const n = sc.distanceMm / printedMm;
  const p = 10 ** Math.max(0, Math.floor(Math.log10(n)) - 1);
  return (Math.round(n / p) * p).toLocaleString("en-GB");
}

function ZonePlanDocument({ data, paper }: { data: ZonePlanPdfData; paper: "a3" | "a4" }) {
  const page = PAPER[paper];
  const areaW = page.width - 2 * MARGIN - SIDE - 10;
  const areaH = page.height - 2 * MARGIN - 40 - 44;
  const img = data.image;
  const k = img ? Math.min(areaW / img.width, areaH / img.height) : 1;
  const w = img ? img.width * k : areaW;
  const h = img ? img.height * k : 0;
  const pin = paper === "a3" ? 11 : 9;
  const shownUnpinned = data.unpinned.slice(0, paper === "a3" ? 40 : 22);
  return (
    <Document title={`${data.zoneName} — plan`} author="Strutwise">
      <Page size={{ width: page.width, height: page.height }} style={s.page}>
        <View style={s.header}>
          <View>
            <Text style={s.title}>{data.zoneName} — plan with members</Text>
            <Text style={s.sub}>{data.siteName}</Text>
          </View>
          <View>
            <Text style={s.sub}>Printed {data.generatedAt}</Text>
            {data.filterText ? <Text style={s.sub}>Showing: {data.filterText}</Text> : null}
            {img && data.scale ? <Text style={s.sub}>Scale on this print about 1:{printScale(data.scale, k)}</Text> : null}
          </View>
        </View>
        <View style={s.row}>
          <View style={{ width: areaW }}>
            {img ? (
              <View style={{ position: "relative", width: w, height: h, borderWidth: 0.5, borderColor: "#000" }}>
                <Image src={{ data: img.data, format: img.format }} style={{ width: w, height: h }} />
                {data.pins.map((p, i) => (
                  <View key={`p${i}`} style={{ position: "absolute", left: p.x * w - pin / 2, top: p.y * h - pin / 2, width: pin, height: pin }}>
                    <PinIcon state={p.state} size={pin} />
                  </View>
                ))}
                {data.pins.map((p, i) => (
                  <Text key={`l${i}`} style={[s.label, { left: p.x * w + pin / 2, top: p.y * h - 4 }]}>
                    {p.tag} {lookOf(p.state).word}
                    {p.utilisation !== "—" ? ` ${p.utilisation}` : ""}
                  </Text>
                ))}
              </View>
            ) : (
              <Text style={s.empty}>This zone has no plan yet.</Text>
            )}
          </View>
          <View style={s.side}>
            <Text style={s.h2}>Legend</Text>
            {PIN_STATES.map((st) => (
              <View key={st} style={s.legendRow} wrap={false}>
                <PinIcon state={st} size={10} />
                <Text style={s.legendText}>
                  {lookOf(st).word} ({data.counts[st] ?? 0}): {lookOf(st).legend}
                </Text>
              </View>
            ))}
            <Text style={s.h2}>Not placed on the plan ({data.unpinned.length})</Text>
            {data.unpinned.length === 0 ? <Text>Every member shown is placed.</Text> : null}
            {shownUnpinned.map((m, i) => (
              <Text key={i}>
                {m.tag} — {m.word}
                {m.utilisation !== "—" ? `, ${m.utilisation}` : ""}
              </Text>
            ))}
            {data.unpinned.length > shownUnpinned.length ? <Text>… and {data.unpinned.length - shownUnpinned.length} more (see the register).</Text> : null}
          </View>
        </View>
        <View style={s.caution} wrap={false}>
          <Text>
            <Text style={{ fontWeight: 700 }}>Caution: </Text>
            {CAUTION_TEXT}
          </Text>
        </View>
      </Page>
    </Document>
  );
}

export function renderZonePlanDocument(data: ZonePlanPdfData, paper: "a3" | "a4") {
  return renderToBuffer(<ZonePlanDocument data={data} paper={paper} />);
}


