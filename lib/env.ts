// Environment, parsed once. Local defaults need no .env; production sets every value
// (see .env.example) and STRUTWISE_REQUIRE_CONFIG=true makes the defaults refuse to apply.
import { z } from "zod";

const bool = z
  .enum(["true", "false", "1", "0"])
  .transform((v) => v === "true" || v === "1");

const LOCAL_SECRET = "local-development-secret-not-for-production-use";

const schema = z.object({
  DATABASE_URL: z.string().url().default("postgres://postgres@127.0.0.1:55432/strutwise"),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16).default(LOCAL_SECRET),
  S3_ENDPOINT: z.string().url().optional().default("http://127.0.0.1:4569"),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("strutwise"),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  S3_FORCE_PATH_STYLE: bool.default(true),
  /** The address browsers use for presigned URLs, when it differs from S3_ENDPOINT. */
  S3_PUBLIC_ENDPOINT: z.string().url().optional(),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default("Strutwise <no-reply@strutwise.local>"),
  INBOX_URL: z.string().url().optional(),
  STRUTWISE_REQUIRE_CONFIG: bool.default(false),
});

export type Env = z.infer<typeof schema>;

function load(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment configuration:\n${lines}`);
  }
  const env = parsed.data;
  if (env.STRUTWISE_REQUIRE_CONFIG) {
    const missing = ["DATABASE_URL", "APP_URL", "NEXTAUTH_SECRET", "S3_BUCKET", "SMTP_HOST"].filter((k) => !process.env[k]);
    if (missing.length) throw new Error(`Production configuration is missing: ${missing.join(", ")}`);
    if (env.NEXTAUTH_SECRET === LOCAL_SECRET) throw new Error("NEXTAUTH_SECRET must be set to a private value in production");
  }
  return env;
}

export const env = load();
