import { env } from "@/lib/env";

/** The online permit, as printed in the PDF's QR code and linked from e-mails. */
export const permitUrl = (siteId: string, permitId: string) => `${env.APP_URL.replace(/\/$/, "")}/sites/${siteId}/permits/${permitId}`;
