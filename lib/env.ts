// Environment, parsed once. Local defaults need no .env; production sets every value
// (see .env.example) and STRUTWISE_REQUIRE_CONFIG=true makes the defaults refuse to apply.
import { availableParallelism } from "node:os";
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
  /**
   * Database connections this process keeps open at most. Unset: two per CPU the process may use,
   * plus one (common practice: the PostgreSQL wiki's "number of database connections" rule of
   * thumb, cores × 2 + one disk), at least 4 and at most 20 — one Node process serves requests on
   * one event loop, so more connections than that only queue inside PostgreSQL. Leave room for
   * every app and worker process under the server's max_connections.
   */
  DB_POOL_MAX: z.coerce
    .number({ error: "DB_POOL_MAX must be a whole number of connections from 1 to 200." })
    .int("DB_POOL_MAX must be a whole number of connections from 1 to 200.")
    .min(1, "DB_POOL_MAX must be a whole number of connections from 1 to 200.")
    .max(200, "DB_POOL_MAX must be a whole number of connections from 1 to 200.")
    .default(() => defaultPoolMax()),
});

/** The pool size used when DB_POOL_MAX is not set (see the schema above). */
export function defaultPoolMax(cpus = availableParallelism()): number {
  return Math.min(20, Math.max(4, 2 * cpus + 1));
}

export type Env = z.infer<typeof schema>;

/** Parses an environment (process.env for the app; tests pass their own). */
export function parseEnv(source: Record<string, string | undefined>): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment configuration:\n${lines}`);
  }
  const env = parsed.data;
  if (env.STRUTWISE_REQUIRE_CONFIG) {
    const missing = ["DATABASE_URL", "APP_URL", "NEXTAUTH_SECRET", "S3_BUCKET", "SMTP_HOST"].filter((k) => !source[k]);
    if (missing.length) throw new Error(`Production configuration is missing: ${missing.join(", ")}`);
    if (env.NEXTAUTH_SECRET === LOCAL_SECRET) throw new Error("NEXTAUTH_SECRET must be set to a private value in production");
  }
  return env;
}

export const env = parseEnv(process.env);
