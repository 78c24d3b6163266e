// The one database client. Only db/** imports `db`/`sql` (an ESLint rule keeps it so): query
// modules take `tx = db` to compose, and use cases outside db/ open a transaction with `transaction`.
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { __strutwiseSql?: postgres.Sql };

// One pool per process; reused across hot reloads in development.
export const sql =
  globalForDb.__strutwiseSql ??
  // connect_timeout: during a database restart a request fails within seconds (503) instead of hanging.
  // max: DB_POOL_MAX (lib/env.ts: by default from the CPUs this process may use).
  postgres(env.DATABASE_URL, { max: env.DB_POOL_MAX, connect_timeout: 5, onnotice: () => {} });
globalForDb.__strutwiseSql = sql;

export const db = drizzle(sql, { schema });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** A database handle that may be the pool or an open transaction. */
export type DbOrTx = Db | Tx;

/** Work to run once a transaction has committed (see onCommit). */
const commitHooks = new WeakMap<object, (() => void)[]>();

/** One transaction for a use case that composes several db/queries functions (pass `tx` to each). */
export async function transaction<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  const hooks: (() => void)[] = [];
  const result = await db.transaction((tx) => {
    commitHooks.set(tx, hooks);
    return fn(tx);
  });
  for (const h of hooks) h();
  return result;
}

/**
 * Runs `fn` after `tx` commits (at once when `tx` is the pool, or a transaction not opened by
 * `transaction` above — a nested one, say — in which case it also runs at once; callers that need
 * it after commit use it as a second, not only, safeguard). Never runs for a rolled-back one.
 */
export function onCommit(tx: DbOrTx, fn: () => void): void {
  const hooks = commitHooks.get(tx);
  if (hooks) hooks.push(fn);
  else fn();
}
