import { siteRoute } from "@/lib/api/route";
import { completeSchemeFile } from "@/lib/register/schemes";
import { schemeFileCompleteSchema } from "@/lib/validations/scheme";

/** { kind, key, … } → the scheme with the document recorded (after checking it is a PDF or an image). */
export const POST = siteRoute({ resource: "scheme", permission: "manageSchemes", body: schemeFileCompleteSchema }, (ctx) => completeSchemeFile(ctx));
