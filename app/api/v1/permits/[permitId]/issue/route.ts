// Issue: 403 unless coordinator (or delegated supervisor), 409 if someone else decided first,
// 422 with every failing precondition listed per member.
import { apiHandler } from "@/lib/api";
import { ValidationError } from "@/lib/errors";
import { requireApiUser } from "@/lib/auth";
import { issuePermit, permitDetail, permitJson } from "@/lib/permits";

export const POST = apiHandler<{ permitId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  // An empty body means the defaults: validity from the site's settings, no conditions.
  const text = await req.text();
  let body: unknown = {};
  if (text.trim()) {
    try {
      body = JSON.parse(text);
    } catch {
      throw new ValidationError({ _: "The request body must be JSON." }, "The request body must be JSON.");
    }
    if (!body || typeof body !== "object" || Array.isArray(body)) throw new ValidationError({ _: "The request body must be a JSON object." }, "The request body must be a JSON object.");
  }
  const { pdfReady } = await issuePermit({ user, permitId: params.permitId, body });
  return { permit: permitJson(await permitDetail(user, params.permitId)), pdfReady };
});
