// Issue: 403 unless coordinator (or delegated supervisor) and not the requester, 409 if someone
// else decided first, 422 with every failing precondition listed per member. An empty body means
// the defaults: validity from the site's settings, no conditions.
import { siteRoute } from "@/lib/api/route";
import { issuePermit, mayIssue, permitJson } from "@/lib/permits";
import { permitIssueSchema } from "@/lib/validations/permit";

export const POST = siteRoute(
  { resource: "permit", permission: "viewSite", authorize: mayIssue, body: permitIssueSchema, bodyMode: "optional-json" },
  async (ctx) => {
    const { detail, pdfReady } = await issuePermit(ctx);
    return { permit: permitJson(detail), pdfReady };
  },
);
