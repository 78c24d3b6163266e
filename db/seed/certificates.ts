// Demo design check certificates: a generated one-page PDF per scheme, so permits to load can be
// issued in the demo. The transfer-beam falsework (category 3) is left without one on purpose,
// so its permit review shows the "no check certificate" refusal.
import { createElement as h } from "react";
import { Document, Page, Text, renderToBuffer } from "@react-pdf/renderer";
import { eq } from "drizzle-orm";
import * as schema from "@/db/schema";
import type { Tx } from "@/db";
import { putObject } from "@/lib/storage";

export const SCHEME_WITHOUT_CERTIFICATE = "TW-WXW-021";
/** An invented checker for the demo certificates. */
const CHECKER = "Hollin Check Engineering (demo)";

export async function seedCertificates(tx: Tx, { designerName, now }: { designerName: string; now: number }) {
  const rows = await tx.select({ id: schema.schemes.id, siteId: schema.schemes.siteId, reference: schema.schemes.reference, title: schema.schemes.title, category: schema.schemes.category }).from(schema.schemes);
  for (const s of rows) {
    if (s.reference === SCHEME_WITHOUT_CERTIFICATE || s.category < 1) continue;
    const pdf = await renderToBuffer(
      h(
        Document,
        { title: `${s.reference} design check certificate (demo)` },
        h(
          Page,
          { size: "A4", style: { padding: 48, fontSize: 12 } },
          h(Text, { style: { fontSize: 18, marginBottom: 16 } }, "Design check certificate — demo document, generated"),
          h(Text, null, `Scheme: ${s.reference} — ${s.title}`),
          h(Text, null, `Design check category: ${s.category}`),
          h(Text, null, `Designer: ${designerName}`),
          h(Text, null, `Checked by: ${CHECKER} on ${new Date(now).toISOString().slice(0, 10)} (invented for the demonstration)`),
        ),
      ),
    );
    const key = `sites/${s.siteId}/schemes/${s.id}/certificate-demo.pdf`;
    await putObject(key, pdf, "application/pdf");
    await tx.update(schema.schemes).set({ certificateKey: key }).where(eq(schema.schemes.id, s.id));
    // The certificate as a document: who checked, in which category, when.
    await tx.insert(schema.schemeDocuments).values({
      schemeId: s.id,
      kind: "certificate",
      objectKey: key,
      contentType: "application/pdf",
      sizeBytes: pdf.length,
      checkerName: CHECKER,
      checkCategory: s.category,
      documentDate: new Date(now).toISOString().slice(0, 10),
    });
  }
}
