// The one database client. Query modules import `db` (and take `tx = db` to compose).
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { __strutwiseSql?: postgres.Sql };

// One pool per process; reused across hot reloads in development.
export const sql =
  globalForDb.__strutwiseSql ??
  postgres(env.DATABASE_URL, { max: Number(process.env.DB_POOL_MAX ?? 10), onnotice: () => {} });
globalForDb.__strutwiseSql = sql;

export const db = drizzle(sql, { schema });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** A database handle that may be the pool or an open transaction. */
export type DbOrTx = Db | Tx;

/** One unit of work: every query given `tx` commits together or not at all. */
export function transaction<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  return db.transaction(fn);
}
