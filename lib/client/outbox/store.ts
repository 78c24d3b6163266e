// The outbox on the phone: writes made with no signal (or refused by a weak one) wait here, in
// IndexedDB, until the server has them — through a reload, closing the browser or a flat battery.
// Photos wait as blobs in their own store, uploaded by the same presigned path when online.
import { openDB, type DBSchema, type IDBPDatabase } from "idb";
import type { EditDisplay } from "./edit-view";

export type OutboxKind = "member" | "inspection" | "edit";

export type WaitingPhoto = {
  /** The upload's clientId: a retried presign returns the same photo. */
  clientId: string;
  name: string;
  type: string;
  size: number;
  /** Set once the photo is confirmed on the server. */
  photoId?: string;
  thumbnailUrl?: string | null;
};

export type OutboxItem = {
  /** The write's clientId (creates) or its own id (edits). */
  id: string;
  kind: OutboxKind;
  /** Who saved it: it is sent only while that person is signed in on this phone. */
  userId?: string;
  siteId: string;
  /** What a person reads in the list: "Member P-101", "Inspection of P-7". */
  label: string;
  method: "POST" | "PATCH";
  path: string;
  /** Where this item's photos are presigned. */
  presignPath: string;
  body: Record<string, unknown>;
  /** Photo ids already on the server before the item was queued. */
  photoIds: string[];
  photos: WaitingPhoto[];
  status: "waiting" | "sending" | "refused" | "conflict";
  /** Why the server refused it, in its own words, and per field. */
  reason?: string;
  fields?: Record<string, string>;
  /** For an edit conflict: the member as the server has it now. */
  current?: unknown;
  /** For an edit: the site's units and the names of its zones, schemes and types, to show it in words. */
  display?: EditDisplay;
  /** 0–1 while sending. */
  progress?: number;
  step?: string;
  /** The check the phone ran while offline: provisional, replaced by the server's. */
  provisional?: { capacityN: number | null; utilisation: number | null; pass: boolean };
  queuedAt: string;
};

interface OutboxDb extends DBSchema {
  items: { key: string; value: OutboxItem; indexes: { queuedAt: string } };
  blobs: { key: string; value: { clientId: string; blob: Blob } };
}

const DB_NAME = "strutwise-outbox";
let dbp: Promise<IDBPDatabase<OutboxDb>> | null = null;

function db() {
  dbp ??= openDB<OutboxDb>(DB_NAME, 1, {
    upgrade(d) {
      const items = d.createObjectStore("items", { keyPath: "id" });
      items.createIndex("queuedAt", "queuedAt");
      d.createObjectStore("blobs", { keyPath: "clientId" });
    },
  });
  return dbp;
}

// The person signed in on this page (set by the header): their entries are the ones listed and
// sent. Entries saved by someone else on this phone wait until that person signs in again.
let currentUser: string | null = null;
export function setOutboxUser(userId: string) {
  currentUser = userId;
}
export function outboxUser() {
  return currentUser;
}
/**
 * Whether this item is the signed-in person's. An entry saved before entries were keyed per
 * person has no owner and goes with whoever is signed in next.
 */
export function isMine(item: Pick<OutboxItem, "userId">, userId: string | null = currentUser) {
  return userId != null && (item.userId == null || item.userId === userId);
}

type SentMessage = { type: "sent"; id: string; data: unknown };

// Every tab (and the list in the header) hears of a change, and a form still open on an entry
// hears when the server has it (with the server's answer).
const listeners = new Set<() => void>();
const sentListeners = new Set<(id: string, data: unknown) => void>();
let channel: BroadcastChannel | null = null;
function bus() {
  if (!channel && typeof BroadcastChannel !== "undefined") {
    channel = new BroadcastChannel("strutwise-outbox");
    channel.onmessage = (e: MessageEvent<"changed" | SentMessage>) => {
      const msg = e.data;
      if (typeof msg === "object" && msg?.type === "sent") sentListeners.forEach((l) => l(msg.id, msg.data));
      else listeners.forEach((l) => l());
    };
  }
  return channel;
}
/** The server has stored this entry: its answer goes to any form waiting on it, in every tab. */
export function announceSent(id: string, data: unknown) {
  sentListeners.forEach((l) => l(id, data));
  bus()?.postMessage({ type: "sent", id, data } satisfies SentMessage);
}
export function onSent(listener: (id: string, data: unknown) => void) {
  bus();
  sentListeners.add(listener);
  return () => void sentListeners.delete(listener);
}
function changed() {
  listeners.forEach((l) => l());
  bus()?.postMessage("changed");
}
export function subscribe(listener: () => void) {
  bus();
  listeners.add(listener);
  return () => void listeners.delete(listener);
}

/** Every item, oldest first: the order they are sent in. */
export async function listItems(): Promise<OutboxItem[]> {
  return (await db()).getAllFromIndex("items", "queuedAt");
}

/** Stores the item and its photos' bytes in one transaction: both or neither. */
export async function putItem(item: OutboxItem, blobs: { clientId: string; blob: Blob }[] = []) {
  const tx = (await db()).transaction(["items", "blobs"], "readwrite");
  await Promise.all([tx.objectStore("items").put(item), ...blobs.map((b) => tx.objectStore("blobs").put(b)), tx.done]);
  changed();
}

export async function updateItem(id: string, patch: Partial<OutboxItem>) {
  const d = await db();
  const tx = d.transaction("items", "readwrite");
  const cur = await tx.store.get(id);
  if (cur) await tx.store.put({ ...cur, ...patch });
  await tx.done;
  changed();
}

export async function getBlob(clientId: string) {
  return (await (await db()).get("blobs", clientId))?.blob ?? null;
}

/** The server has it: the item and its photos' bytes go. */
export async function removeItem(item: OutboxItem) {
  const tx = (await db()).transaction(["items", "blobs"], "readwrite");
  await Promise.all([tx.objectStore("items").delete(item.id), ...item.photos.map((p) => tx.objectStore("blobs").delete(p.clientId)), tx.done]);
  changed();
}
