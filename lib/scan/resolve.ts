// What a scanned (or typed) label text opens. Pure, so the scanner, the photo fallback, the typed
// fallback and the tests agree. A label's QR code holds `{APP_URL}/sites/{siteId}/members/{memberId}`
// (lib/pdf/labels.tsx); a plain tag is looked up on the site. Only this app's own addresses are
// followed: a code pointing anywhere else is refused with the reason, never opened.
import { tagSchema } from "@/lib/validations/member";

export type ScanTarget =
  /** A page of this app: open it. */
  | { kind: "open"; href: string }
  /** A tag: open the member with it on this site, or the log form with it filled in. */
  | { kind: "tag"; tag: string }
  | { kind: "refused"; reason: string };

const UUID = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
/** The app pages a label may open: a member, or the log form (with `?tag=`). */
const FOLLOWED = new RegExp(`^/sites/${UUID}/members/(${UUID}|new)/?$`, "i");

/**
 * `origins`: the addresses this app is reached at (the browser's own origin, and APP_URL that the
 * labels were printed with, which differ behind a proxy).
 */
export function resolveScan(text: string, { origins }: { origins: readonly string[] }): ScanTarget {
  const raw = text.trim();
  if (!raw) return { kind: "refused", reason: "Nothing was read. Type the tag printed on the label." };
  if (/^[a-z][a-z0-9+.-]*:/i.test(raw) || raw.startsWith("//") || raw.startsWith("/")) {
    let url: URL;
    try {
      url = new URL(raw, origins[0] ?? "http://invalid.invalid");
    } catch {
      return { kind: "refused", reason: "The code holds an address that cannot be read; it was not opened." };
    }
    const own = new Set(origins.map((o) => safeOrigin(o)).filter(Boolean));
    if (!["http:", "https:"].includes(url.protocol) || !own.has(url.origin))
      return { kind: "refused", reason: `This code points to ${url.protocol === "http:" || url.protocol === "https:" ? url.host : "another kind of address"}, not to Strutwise here, so it was not opened.` };
    if (!FOLLOWED.test(url.pathname))
      return { kind: "refused", reason: "This code is a Strutwise address but not a member's label; it was not opened." };
    const tag = url.searchParams.get("tag");
    const href = url.pathname.replace(/\/$/, "") + (tag !== null ? `?tag=${encodeURIComponent(tag)}` : "");
    return { kind: "open", href };
  }
  const tag = tagSchema.safeParse(raw);
  if (!tag.success) return { kind: "refused", reason: `"${raw.slice(0, 60)}" is not a member tag: ${tag.error.issues[0]?.message ?? "check it against the label."}` };
  return { kind: "tag", tag: tag.data };
}

function safeOrigin(o: string): string {
  try {
    return new URL(o).origin;
  } catch {
    return "";
  }
}
