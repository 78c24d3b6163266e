// Sends the outbox in the order it was filled, one item at a time: its photos first (presign with
// the photo's clientId → PUT the blob → complete), then the write itself with its clientId, so a
// request retried after a lost answer never makes a second record. No signal or a server fault:
// the item waits and sending stops until the next try. A refusal (422/409) stays with its reason.
// One sender at a time across every tab (a Web Lock); an item left "sending" by a run that was cut
// short (a reload, a closed tab) goes back to waiting, and a request that never answers times out.
import { apiJson, putWithProgress, type ApiError } from "@/lib/client/api";
import { announceSent, getBlob, isMine, listItems, outboxUser, removeItem, updateItem, type OutboxItem } from "./store";

let running: Promise<SendSummary> | null = null;

export type SendSummary = { sent: number; refused: number; waiting: number };

const LOCK = "strutwise-outbox";
/** How long one request may go unanswered (or a photo upload make no progress) before the item waits again. */
const REQUEST_TIMEOUT_MS = 30_000;

function locks(): LockManager | null {
  return typeof navigator !== "undefined" && navigator.locks && typeof navigator.locks.request === "function" ? navigator.locks : null;
}

/** Sends what is waiting; concurrent calls in this tab share one run, other tabs wait their turn. */
export function sendAll(): Promise<SendSummary> {
  const lm = locks();
  // Without Web Locks (an old browser) the run still happens, one per tab.
  running ??= (lm ? lm.request(LOCK, () => run()).then((r) => r) : run()).finally(() => {
    running = null;
  });
  return running;
}

/** Items marked "sending" by a run that no longer exists: back to waiting, so they are sent again. */
async function resetStale() {
  for (const item of await listItems()) {
    if (item.status === "sending") await updateItem(item.id, { status: "waiting", progress: undefined, step: undefined });
  }
}

/**
 * When the app opens: if no tab is sending right now (the lock is free), whatever still says
 * "sending" was cut short and goes back to waiting. Without Web Locks, a run in this tab is the only
 * one that could be sending.
 */
export async function releaseStaleSending(): Promise<void> {
  const lm = locks();
  if (!lm) {
    if (!running) await resetStale();
    return;
  }
  await lm.request(LOCK, { ifAvailable: true }, async (lock) => {
    if (lock) await resetStale();
  });
}

const retryLater = (e: ApiError) => e.offline || e.status === 0 || e.status >= 500 || e.status === 429 || e.status === 401;

async function run(): Promise<SendSummary> {
  const summary: SendSummary = { sent: 0, refused: 0, waiting: 0 };
  // This run holds the lock: nothing else is sending, so "sending" is left over from a cut-short run.
  await resetStale();
  // Only the signed-in person's entries, and only while the server agrees who that is: the session
  // cookie is shared by every tab, so another person may have signed in elsewhere since this page loaded.
  const me = outboxUser();
  const items = (await listItems()).filter((i) => isMine(i, me));
  if (!me || items.length === 0) return summary;
  const who = await apiJson<{ user: { id: string } }>("/api/v1/me", { timeoutMs: REQUEST_TIMEOUT_MS });
  if (!who.ok || who.data.user.id !== me) {
    summary.waiting = items.filter((i) => i.status === "waiting").length;
    return summary;
  }
  for (const item of items) {
    if (item.status === "refused" || item.status === "conflict") {
      summary.refused += 1;
      continue;
    }
    const outcome = await sendOne(item);
    if (outcome === "sent") summary.sent += 1;
    else if (outcome === "refused") summary.refused += 1;
    else {
      // No signal, or the server is down: everything after this one waits too, in order.
      summary.waiting = (await listItems()).filter((i) => isMine(i, me) && (i.status === "waiting" || i.status === "sending")).length;
      return summary;
    }
  }
  return summary;
}

async function sendOne(item: OutboxItem): Promise<"sent" | "refused" | "later"> {
  const total = item.photos.length + 1;
  await updateItem(item.id, { status: "sending", progress: 0, step: item.photos.length ? "Sending photos" : "Sending" });
  const photos = [...item.photos];
  for (let n = 0; n < photos.length; n++) {
    const p = photos[n]!;
    if (p.photoId) continue;
    const blob = await getBlob(p.clientId);
    if (!blob) return refuse(item, { reason: `The photo ${p.name} is no longer on this phone; remove it and take it again.`, fields: { photoIds: "A photo is missing on this phone." } });
    const start = await apiJson<{ photoId: string; uploadUrl: string; status: string; headers: Record<string, string> }>(item.presignPath, {
      body: { contentType: p.type, size: p.size, clientId: p.clientId },
      timeoutMs: REQUEST_TIMEOUT_MS,
    });
    if (!start.ok) return retryLater(start.error) ? wait(item) : refuse(item, { reason: `Photo ${p.name}: ${Object.values(start.error.fields)[0] ?? start.error.message}`, fields: start.error.fields });
    if (start.data.status === "pending") {
      // A large photo on a weak signal may take minutes: it is given up only when it stops moving.
      const stalled = new AbortController();
      let timer = setTimeout(() => stalled.abort(), REQUEST_TIMEOUT_MS);
      try {
        await putWithProgress(
          start.data.uploadUrl,
          blob,
          p.type,
          (f) => {
            clearTimeout(timer);
            timer = setTimeout(() => stalled.abort(), REQUEST_TIMEOUT_MS);
            void updateItem(item.id, { progress: (n + f) / total, step: `Sending photo ${n + 1} of ${photos.length}` });
          },
          stalled.signal,
        );
      } catch {
        return wait(item);
      } finally {
        clearTimeout(timer);
      }
    }
    const done = await apiJson<{ photo: { id: string; thumbnailUrl: string | null } }>(`/api/v1/photos/${start.data.photoId}/complete`, { body: {}, timeoutMs: REQUEST_TIMEOUT_MS });
    if (!done.ok) return retryLater(done.error) ? wait(item) : refuse(item, { reason: `Photo ${p.name}: ${done.error.fields.photo ?? done.error.message}`, fields: done.error.fields });
    photos[n] = { ...p, photoId: done.data.photo.id, thumbnailUrl: done.data.photo.thumbnailUrl };
    await updateItem(item.id, { photos, progress: (n + 1) / total });
  }
  const photoIds = [...item.photoIds, ...photos.map((p) => p.photoId!)];
  await updateItem(item.id, { step: "Saving", progress: (total - 1) / total });
  const body = { ...item.body, ...(photoIds.length ? { photoIds } : {}) };
  const r = await apiJson(item.path, { method: item.method, body, timeoutMs: REQUEST_TIMEOUT_MS });
  if (r.ok) {
    await removeItem({ ...item, photos });
    announceSent(item.id, r.data);
    return "sent";
  }
  if (retryLater(r.error)) return wait(item);
  if (r.error.status === 409 && item.kind === "edit") {
    await updateItem(item.id, { status: "conflict", reason: r.error.message, fields: r.error.fields, current: r.error.current, progress: undefined, step: undefined });
    return "refused";
  }
  return refuse(item, { reason: r.error.message, fields: r.error.fields });
}

async function wait(item: OutboxItem) {
  await updateItem(item.id, { status: "waiting", progress: undefined, step: undefined });
  return "later" as const;
}

async function refuse(item: OutboxItem, { reason, fields }: { reason: string; fields?: Record<string, string> }) {
  await updateItem(item.id, { status: "refused", reason, fields: fields ?? {}, progress: undefined, step: undefined });
  return "refused" as const;
}
