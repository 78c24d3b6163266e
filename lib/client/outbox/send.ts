// Sends the outbox in the order it was filled, one item at a time: its photos first (presign with
// the photo's clientId → PUT the blob → complete), then the write itself with its clientId, so a
// request retried after a lost answer never makes a second record. No signal or a server fault:
// the item waits and sending stops until the next try. A refusal (422/409) stays with its reason.
import { apiJson, putWithProgress, type ApiError } from "@/lib/client/api";
import { getBlob, listItems, removeItem, updateItem, type OutboxItem } from "./store";

let running: Promise<SendSummary> | null = null;

export type SendSummary = { sent: number; refused: number; waiting: number };

// One sender per phone, across tabs: the run holds a Web Lock for as long as it sends. A run
// cut short (the page reloaded, the tab closed) lets go of the lock with the page, so an item
// still marked "sending" with the lock free is waiting again.
const LOCK = "strutwise-outbox";
// A request that hangs on a weak signal gives up and the item waits for the next try.
const REQUEST_TIMEOUT_MS = 30_000;
const UPLOAD_TIMEOUT_MS = 180_000;

function locks(): LockManager | null {
  return typeof navigator !== "undefined" && navigator.locks ? navigator.locks : null;
}

/** Sends what is waiting; concurrent calls share one run. */
export function sendAll(): Promise<SendSummary> {
  const lm = locks();
  const locked = async (): Promise<SendSummary> => (lm ? ((await lm.request(LOCK, run)) as SendSummary) : run());
  running ??= locked().finally(() => {
    running = null;
  });
  return running;
}

/** Items left "sending" by a run that no longer exists go back to waiting. */
export async function releaseStale(): Promise<void> {
  const lm = locks();
  if (!lm) {
    if (!running) await resetSending();
    return;
  }
  await lm.request(LOCK, { ifAvailable: true }, async (lock) => {
    if (lock) await resetSending();
  });
}

async function resetSending() {
  for (const item of await listItems()) {
    if (item.status === "sending") await updateItem(item.id, { status: "waiting", progress: undefined, step: undefined });
  }
}

const retryLater = (e: ApiError) => e.offline || e.status === 0 || e.status >= 500 || e.status === 429 || e.status === 401;

async function run(): Promise<SendSummary> {
  const summary: SendSummary = { sent: 0, refused: 0, waiting: 0 };
  // This run holds the lock: nothing else is sending, so "sending" is a leftover.
  await resetSending();
  const items = await listItems();
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
      summary.waiting = (await listItems()).filter((i) => i.status === "waiting" || i.status === "sending").length;
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
      try {
        await putWithProgress(
          start.data.uploadUrl,
          blob,
          p.type,
          (f) => void updateItem(item.id, { progress: (n + f) / total, step: `Sending photo ${n + 1} of ${photos.length}` }),
          AbortSignal.timeout(UPLOAD_TIMEOUT_MS),
        );
      } catch {
        return wait(item);
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
