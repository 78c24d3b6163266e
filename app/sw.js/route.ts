// /sw.js: the service worker built beside the app (scripts/build-sw.mjs). Public, like the app's
// icons: it carries no data, and it must load before anyone signs in.
import { readFile } from "node:fs/promises";
import path from "node:path";

export const dynamic = "force-dynamic";

export async function GET() {
  const file = path.join(process.cwd(), process.env.NEXT_DIST_DIR || ".next", "sw.js");
  try {
    const body = await readFile(file, "utf8");
    return new Response(body, {
      headers: { "content-type": "text/javascript; charset=utf-8", "cache-control": "no-cache", "service-worker-allowed": "/" },
    });
  } catch {
    return new Response("// The service worker was not built: run `npm run build`.\n", {
      status: 404,
      headers: { "content-type": "text/javascript; charset=utf-8", "cache-control": "no-store" },
    });
  }
}
