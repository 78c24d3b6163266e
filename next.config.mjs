/** @type {import('next').NextConfig} */
const nextConfig = {
  // npm test builds into its own folder so it never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  output: process.env.NEXT_OUTPUT_STANDALONE === "true" ? "standalone" : undefined,
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  images: { unoptimized: true },
  serverExternalPackages: ["pg-boss", "@napi-rs/canvas", "unpdf"],
};

export default nextConfig;
