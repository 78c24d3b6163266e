// Applies the committed migrations (run by `npm start`, `npm test` and the Docker entrypoint).
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";
import path from "node:path";

const url = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:55432/strutwise";
const sql = postgres(url, { max: 1, onnotice: () => {} });
await migrate(drizzle(sql), { migrationsFolder: path.join(import.meta.dirname, "migrations") });
await sql.end();
