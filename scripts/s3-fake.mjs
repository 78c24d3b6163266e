// The S3-compatible fake for local runs and tests: s3rver on loopback, files under .data/.
import S3rver from "s3rver";
import fs from "node:fs";

const port = Number(process.env.S3_FAKE_PORT ?? 4569);
const directory = process.env.S3_FAKE_DIR ?? ".data/s3";
const buckets = (process.env.S3_FAKE_BUCKETS ?? "strutwise").split(",");
fs.mkdirSync(directory, { recursive: true });

// Browsers upload photos straight to the store with presigned PUTs, so it must answer CORS.
const cors = `<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>`;

const server = new S3rver({
  address: "127.0.0.1",
  port,
  directory,
  silent: true,
  configureBuckets: buckets.map((name) => ({ name, configs: [cors] })),
});
await server.run();
console.log(`S3 fake on http://127.0.0.1:${port} (buckets: ${buckets.join(", ")})`);
const stop = async () => {
  await server.close();
  process.exit(0);
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
