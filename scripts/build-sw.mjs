// Builds the service worker after `next build`: esbuild bundles lib/client/sw/service-worker.ts,
// then @serwist/build injects the list of the build's static files to precache (the app shell).
// The result is <distDir>/sw.js, served at /sw.js by app/sw.js/route.ts. Works with Turbopack
// builds (nothing hooks into the bundler), so `next build` stays as it is.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { injectManifest } from "@serwist/build";
import { build } from "esbuild";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export async function buildServiceWorker(distDir = process.env.NEXT_DIST_DIR || ".next") {
  const dist = path.join(root, distDir);
  const bundled = path.join(dist, "sw.src.js");
  await build({
    entryPoints: [path.join(root, "lib/client/sw/service-worker.ts")],
    outfile: bundled,
    bundle: true,
    format: "iife",
    target: "es2020",
    minify: true,
    logLevel: "warning",
  });
  const { count, size, warnings } = await injectManifest({
    swSrc: bundled,
    swDest: path.join(dist, "sw.js"),
    globDirectory: dist,
    globPatterns: ["static/**/*.{js,css,woff2,woff,svg,png}"],
    modifyURLPrefix: { "static/": "/_next/static/" },
    // Hashed file names already change with their content.
    dontCacheBustURLsMatching: /^\/_next\/static\//,
    maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
  });
  for (const w of warnings) console.warn(`[sw] ${w}`);
  console.log(`[sw] ${distDir}/sw.js: ${count} files precached (${Math.round(size / 1024)} KB)`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  await buildServiceWorker(process.argv[2]);
}
