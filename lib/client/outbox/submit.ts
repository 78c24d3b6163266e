// One submit path for the phone's forms: send now when there is signal, otherwise (or when the
// request fails on a weak signal) keep it in the outbox, to be sent once, in order, when the
// connection returns. Every create carries a clientId, so a retry never doubles a record.
import { apiJson, type ApiError } from "@/lib/client/api";
import { sendAll } from "./send";
import { outboxUser, putItem, type OutboxItem, type OutboxKind } from "./store";

export type QueuedPhoto = { name: string; blob: Blob };

export type SubmitRequest = {
  kind: OutboxKind;
  siteId: string;
  label: string;
  method?: "POST" | "PATCH";
  path: string;
  presignPath: string;
  body: Record<string, unknown>;
  /** Photos already on the server (uploaded while there was signal). */
  photoIds?: string[];
  /** Photos taken with no signal: their bytes wait in the outbox. */
  photos?: QueuedPhoto[];
  provisional?: OutboxItem["provisional"];
  display?: OutboxItem["display"];
};

export type SubmitResult<T> =
  | { sent: true; status: number; data: T }
  | { sent: false; queued: true; id: string }
  | { sent: false; queued: false; error: ApiError };

export function newClientId() {
  return crypto.randomUUID();
}

function online() {
  return typeof navigator === "undefined" || navigator.onLine !== false;
}

export async function submitOrQueue<T>(req: SubmitRequest): Promise<SubmitResult<T>> {
  const method = req.method ?? "POST";
  // Creates carry their clientId in the body; an edit carries its baseVersion.
  const id = typeof req.body.clientId === "string" ? req.body.clientId : newClientId();
  const waitingPhotos = req.photos ?? [];
  if (online() && waitingPhotos.length === 0) {
    const photoIds = req.photoIds ?? [];
    const r = await apiJson<T>(req.path, { method, body: { ...req.body, ...(photoIds.length ? { photoIds } : {}) } });
    if (r.ok) return { sent: true, status: r.status, data: r.data };
    const weakSignal = r.error.offline || r.error.status >= 500 || r.error.status === 429;
    if (!weakSignal) return { sent: false, queued: false, error: r.error };
  }
  const photos = waitingPhotos.map((p) => ({ clientId: newClientId(), name: p.name, type: p.blob.type || "image/jpeg", size: p.blob.size, blob: p.blob }));
  await putItem(
    {
      id,
      kind: req.kind,
      userId: outboxUser() ?? undefined,
      siteId: req.siteId,
      label: req.label,
      method,
      path: req.path,
      presignPath: req.presignPath,
      body: req.body,
      photoIds: req.photoIds ?? [],
      photos: photos.map(({ blob: _b, ...p }) => p),
      status: "waiting",
      provisional: req.provisional,
      display: req.display,
      queuedAt: new Date().toISOString(),
    },
    photos.map((p) => ({ clientId: p.clientId, blob: p.blob })),
  );
  if (online()) void sendAll();
  return { sent: false, queued: true, id };
}
