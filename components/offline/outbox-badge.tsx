"use client";
// "Waiting to send" in the header: how many entries this phone still holds, each with its
// progress, "Send now", and for one the server refused: the reason and a way to fix and resend.
// Sending starts by itself when the connection returns and whenever the app opens with signal.
import { useEffect, useRef, useState } from "react";
import { Icon } from "@/components/icons";
import { Button } from "@/components/ui/button";
import { serverReachable } from "@/lib/client/outbox/reachable";
import { releaseStaleSending, sendAll } from "@/lib/client/outbox/send";
import { editFieldLabel, editValueText } from "@/lib/client/outbox/edit-view";
import { removeItem, setOutboxUser, updateItem, type OutboxItem } from "@/lib/client/outbox/store";
import { useOutbox } from "./use-outbox";

export function OutboxBadge({ userId }: { userId: string }) {
  // Set while rendering, before any effect or submit can queue or send: entries are the signed-in person's.
  setOutboxUser(userId);
  const items = useOutbox(userId);
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState<string | null>(null);
  const panelRef = useRef<HTMLDivElement>(null);

  const waiting = (items ?? []).some((i) => i.status === "waiting" || i.status === "sending");
  useEffect(() => {
    const go = () => void serverReachable().then((ok) => { if (ok) void sendAll(); });
    // An entry a reload cut off mid-send says "sending" until it is put back to waiting.
    void releaseStaleSending().catch(() => undefined).then(go);
    window.addEventListener("online", go);
    return () => window.removeEventListener("online", go);
  }, []);
  // While entries wait, try again every 15 seconds: "online" is not always announced.
  useEffect(() => {
    if (!waiting) return;
    const timer = window.setInterval(() => void serverReachable().then((ok) => { if (ok) void sendAll(); }), 15_000);
    return () => window.clearInterval(timer);
  }, [waiting]);

  if (!items || items.length === 0) return null;
  const refused = items.filter((i) => i.status === "refused" || i.status === "conflict").length;

  async function sendNow() {
    setNote(null);
    const r = await sendAll();
    if (r.waiting) setNote("No signal: the entries wait and are sent when the phone is back online.");
  }

  return (
    <div className="relative">
      <button
        type="button"
        className={`flex min-h-touch items-center gap-2 rounded-lg border-2 px-3 font-semibold ${refused ? "border-bad bg-bad-soft text-bad" : "border-warn bg-warn-soft text-ink"}`}
        aria-expanded={open}
        aria-controls="outbox-panel"
        onClick={() => setOpen((o) => !o)}
        data-testid="outbox-badge"
      >
        <Icon name={refused ? "warn" : "more"} className="h-5 w-5" />
        <span>
          <span data-testid="outbox-count">{items.length}</span> waiting to send
        </span>
      </button>
      {open ? (
        <div
          id="outbox-panel"
          ref={panelRef}
          role="region"
          aria-label="Waiting to send"
          className="absolute right-0 z-20 mt-1 max-h-[70vh] w-[min(24rem,90vw)] overflow-y-auto rounded-lg border-2 border-ink/20 bg-paper-raised p-3 shadow-lg"
        >
          <div className="mb-2 flex items-center justify-between gap-2">
            <h2 className="text-lg font-bold">Waiting to send</h2>
            <Button type="button" onClick={() => void sendNow()}>
              Send now
            </Button>
          </div>
          <p className="mb-2 text-sm text-ink-soft">Kept on this phone until the server has them, even if the phone is switched off. Each is sent once.</p>
          {note ? (
            <p role="status" className="mb-2 text-sm font-semibold">
              {note}
            </p>
          ) : null}
          <ul className="flex flex-col gap-2">
            {items.map((it) => (
              <OutboxRow key={it.id} item={it} />
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

function OutboxRow({ item }: { item: OutboxItem }) {
  const queued = new Date(item.queuedAt).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });
  return (
    <li className="rounded-lg border-2 border-ink/15 p-2" data-testid="outbox-item" data-status={item.status}>
      <p className="font-semibold">{item.label}</p>
      <p className="text-xs text-ink-soft">
        Saved on this phone at {queued}
        {item.photos.length ? ` · ${item.photos.length} photo${item.photos.length === 1 ? "" : "s"}` : ""}
      </p>
      {item.provisional ? (
        <p className="text-sm" data-testid="outbox-provisional">
          Provisional — checked on this phone:{" "}
          {item.provisional.utilisation == null ? "no capacity" : `utilisation ${Math.round(item.provisional.utilisation * 100)} % (${item.provisional.pass ? "passes" : "fails"})`}. The server&apos;s check replaces it after sending.
        </p>
      ) : null}
      {item.status === "sending" ? (
        <>
          <progress className="h-3 w-full" max={1} value={item.progress ?? 0} aria-label={`Sending ${item.label}`} />
          <p className="text-xs">{item.step ?? "Sending"}…</p>
        </>
      ) : item.status === "waiting" ? (
        <p className="text-sm">Waiting for signal</p>
      ) : item.status === "conflict" ? (
        <ConflictFix item={item} />
      ) : (
        <RefusedFix item={item} />
      )}
    </li>
  );
}

/** The server's reason, each refused field editable, then resend (the same clientId: nothing was stored). */
function RefusedFix({ item }: { item: OutboxItem }) {
  const fields = Object.entries(item.fields ?? {});
  const editable = fields.filter(([k]) => typeof item.body[k] === "string" || typeof item.body[k] === "number");
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(editable.map(([k]) => [k, String(item.body[k] ?? "")])));
  async function resend() {
    const body = { ...item.body };
    for (const [k] of editable) body[k] = typeof item.body[k] === "number" ? Number(values[k]) : values[k];
    await updateItem(item.id, { body, status: "waiting", reason: undefined, fields: undefined });
    void sendAll();
  }
  return (
    <div className="mt-1 flex flex-col gap-2">
      <p role="alert" className="text-sm font-semibold text-bad" data-testid="outbox-reason">
        Not accepted: {fields.length ? fields.map(([, m]) => m).join(" ") : item.reason}
      </p>
      {editable.map(([k]) => (
        <label key={k} className="flex flex-col text-sm font-semibold">
          {k === "tag" ? "Tag" : k}
          <input
            className="min-h-touch rounded-lg border-2 border-ink/40 px-2"
            value={values[k] ?? ""}
            onChange={(e) => setValues((v) => ({ ...v, [k]: e.target.value }))}
          />
        </label>
      ))}
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={() => void resend()}>
          {editable.length ? "Fix and resend" : "Resend"}
        </Button>
        <Button type="button" variant="secondary" onClick={() => { if (confirm(`Delete ${item.label} from this phone? It was never saved on the server.`)) void removeItem(item); }}>
          Delete
        </Button>
      </div>
    </div>
  );
}

type CurrentMember = { member?: Record<string, unknown> & { version?: number } };

/** An edit made against an older copy: both versions side by side; the person chooses. */
function ConflictFix({ item }: { item: OutboxItem }) {
  const current = (item.current as CurrentMember | undefined)?.member ?? {};
  const keys = Object.keys(item.body).filter((k) => k !== "baseVersion");
  async function keepMine() {
    await updateItem(item.id, { body: { ...item.body, baseVersion: current.version }, status: "waiting", reason: undefined, current: undefined });
    void sendAll();
  }
  return (
    <div className="mt-1 flex flex-col gap-2">
      <p role="alert" className="text-sm font-semibold text-bad" data-testid="outbox-reason">
        {item.reason}
      </p>
      <table className="text-sm">
        <thead>
          <tr>
            <th className="text-left">Field</th>
            <th className="text-left">On this phone</th>
            <th className="text-left">On the server now</th>
          </tr>
        </thead>
        <tbody>
          {keys.map((k) => (
            <tr key={k}>
              <th scope="row" className="text-left font-semibold">{editFieldLabel(k)}</th>
              <td className="tabular">{editValueText(k, item.body[k], item.display)}</td>
              <td className="tabular">{editValueText(k, current[k], item.display, k === "planPosition" ? current : undefined)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={() => void keepMine()}>
          Keep mine
        </Button>
        <Button type="button" variant="secondary" onClick={() => void removeItem(item)}>
          Keep the server&apos;s
        </Button>
      </div>
    </div>
  );
}
