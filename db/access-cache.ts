// Who a signed-in request is, kept in memory between requests instead of read from the database
// on every one (db/queries/users.ts getSessionUserAt). A kept answer is used only while nothing
// that decides access has changed since it was read:
//  - in this process, every write that can change access (people, sites, organisations, roles,
//    signed-out sessions: db/queries/*) calls accessChanged(tx), which drops every kept answer at
//    once and again when its transaction commits, before the use case returns — so the request
//    after a role is removed is refused;
//  - in other processes (another app instance, the worker, a script), statement triggers on the
//    same tables send NOTIFY strutwise_access when their transaction commits, and the listener
//    here drops every kept answer (migration 0013_access_notify);
//  - answers are kept at most KEEP_MS, and only while the listener is connected: after a
//    reconnection, notifications may have been missed, so everything is dropped.
// Nothing is kept for a refused session (signed out, deactivated, old session version): those are
// read again every time. One organisation's answers can never serve another's request — the key is
// the person, the session and the site asked for.
import "server-only";
import postgres from "postgres";
import { env } from "@/lib/env";
import { onCommit, type DbOrTx } from "./index";

export const ACCESS_CHANNEL = "strutwise_access";
const KEEP_MS = 5_000;
const MAX_KEPT = 5_000;

type Kept = { value: unknown; at: number };
const kept = new Map<string, Kept>();
/** Bumped on every change: an answer read while a change happened is not kept. */
let generation = 0;
let listening = false;
let listener: postgres.Sql | null = null;

function forgetAll() {
  generation++;
  kept.clear();
}

/**
 * Its own connection, so a notification is never queued behind the pool's queries. postgres-js
 * calls onclose when that connection ends (database restart, network): answers are dropped and no
 * new ones kept until LISTEN is back.
 */
function startListening() {
  if (listener) return;
  // onnotify is the option postgres-js's own sql.listen uses; its types leave it out.
  const options = {
    max: 1,
    fetch_types: false,
    connect_timeout: 5,
    onnotice: () => {},
    onnotify: (channel: string) => {
      if (channel === ACCESS_CHANNEL) forgetAll();
    },
    onclose: () => {
      listening = false;
      forgetAll();
      relisten(1_000);
    },
  };
  listener = postgres(env.DATABASE_URL, options as postgres.Options<Record<string, postgres.PostgresType>>);
  relisten(0);
}

function relisten(afterMs: number) {
  setTimeout(() => {
    listener!`listen strutwise_access`
      .then(() => {
        forgetAll();
        listening = true;
      })
      .catch(() => {
        listening = false;
        relisten(Math.min(afterMs * 2 || 1_000, 30_000));
      });
  }, afterMs).unref();
}

/** The kept answer for this key, or a fresh one from `read` (kept when it allows access). */
export async function keptAccess<T>(key: string, read: () => Promise<T | null>): Promise<T | null> {
  startListening();
  const now = Date.now();
  const hit = kept.get(key);
  if (hit && listening && now - hit.at < KEEP_MS) return hit.value as T;
  const gen = generation;
  const value = await read();
  if (value !== null && listening && gen === generation) {
    if (kept.size >= MAX_KEPT) kept.delete(kept.keys().next().value!);
    kept.set(key, { value, at: now });
  }
  return value;
}

/** A write that can change who may do what: nothing kept survives it (now, and when `tx` commits). */
export function accessChanged(tx: DbOrTx): void {
  forgetAll();
  onCommit(tx, forgetAll);
}
