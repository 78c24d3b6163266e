// Amend a permit to strike's evidence while the request is open (new cube results, say); the
// earlier evidence stays in the permit's history.
import { siteRoute } from "@/lib/api/route";
import { amendEvidence, permitDetail, permitJson } from "@/lib/permits";
import { amendEvidenceSchema } from "@/lib/validations/permit";

export const PATCH = siteRoute(
  { resource: "permit", permission: "requestPermit", forbidden: "Only an engineer, supervisor or the coordinator on this site may amend striking evidence.", body: amendEvidenceSchema },
  async (ctx) => {
    await amendEvidence(ctx);
    return { permit: permitJson(await permitDetail(ctx)) };
  },
);
