// Failing services lose nothing: a PostgreSQL restart under a running app and worker, the object
// store down during a photo confirmation and a permit issue, and a worker killed mid-delivery.
// Every service here is the real one the stack runs; the test stops and starts them itself.
import { afterAll, describe, expect, it } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { eq, like } from "drizzle-orm";
import { db, sql } from "@/db";
import { outbox, photos } from "@/db/schema";
import { enqueueEmails } from "@/db/queries/outbox";
import { renderPendingPermitPdfs } from "@/lib/permits/pdf";
import { clearInbox, inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import { type ApiErr, as, jpeg, makeMember, post, requestLoad, site, siteId as siteIdOf } from "../support/fixtures";

// The stack's own start/stop functions (plain JavaScript, shared with `npm start` and `npm test`).
const stackPath = path.resolve(import.meta.dirname, "../../scripts/stack.mjs");
type Stack = {
  profile: (name: string) => { name: string; env: Record<string, string> };
  stopPostgres: () => void;
  ensurePostgres: (p: unknown) => Promise<void>;
  ensureS3: (p: unknown) => Promise<void>;
  stopService: (name: string) => Promise<void>;
  tsNodeArgs: string[];
};
const stack = (await import(stackPath)) as Stack;
const p = stack.profile("test");
const root = path.resolve(import.meta.dirname, "../..");

const workers: ChildProcess[] = [];
function startWorker(extraEnv: Record<string, string> = {}) {
  const child = spawn(process.execPath, [...stack.tsNodeArgs, path.join(root, "lib", "jobs", "worker.ts")], {
    cwd: root,
    env: { ...process.env, ...p.env, ...extraEnv },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let log = "";
  child.stdout!.on("data", (d) => (log += d));
  child.stderr!.on("data", (d) => (log += d));
  workers.push(child);
  return { child, log: () => log, started: () => waitFor(async () => log.includes("] started"), "the worker to start", 30_000) };
}
async function kill(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM") {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const gone = new Promise((r) => child.once("exit", r));
  child.kill(signal);
  await gone;
}

afterAll(async () => {
  for (const w of workers) await kill(w, "SIGKILL");
  await stack.ensurePostgres(p);
  await stack.ensureS3(p);
  await sql.end({ timeout: 5 });
});

describe("PostgreSQL restarted while the app and the worker run", () => {
  it("requests during the outage get a clear 503 JSON within 10 s; app and worker recover by themselves", async () => {
    const manager = await as("manager");
    expect((await manager.fetch("/api/v1/sites")).status).toBe(200);
    const worker = startWorker();
    await worker.started();

    stack.stopPostgres();
    try {
      // A bound on how long the request may hang: it must answer, not time out (ASVS V11.1 availability).
      const res = await manager.fetch("/api/v1/sites", { signal: AbortSignal.timeout(10_000) });
      expect(res.status).toBe(503);
      const text = await res.text();
      const body = JSON.parse(text) as ApiErr;
      expect(body.error.code).toBe("unavailable");
      expect(body.error.message).toMatch(/cannot be reached just now; nothing was changed/);
      expect(text).not.toMatch(/at \w+ \(|node_modules|ECONN/); // no stack trace or internals
      expect(res.headers.get("retry-after")).toBe("10");
    } finally {
      await stack.ensurePostgres(p);
    }

    // The same running app answers again with no restart.
    await waitFor(async () => (await manager.fetch("/api/v1/sites")).status === 200, "the app to answer after the restart", 30_000);
    // The same running worker delivers an e-mail queued after the restart.
    expect(worker.child.exitCode).toBeNull();
    await clearInbox();
    const subject = `After the restart ${Date.now()}`;
    await enqueueEmails([{ kind: "test", toEmail: "manager@demo.example", subject, text: "Delivered by a worker that lived through a database restart." }]);
    await waitFor(async () => (await inbox()).some((m) => m.subject === subject), "the worker to deliver after the restart", 30_000);
    await kill(worker.child);
  }, 120_000);
});

describe("the object store down", () => {
  it("a photo confirmation gets a clear 503 and stays unconfirmed; confirmed once the store is back", async () => {
    const engineer = await as("engineer");
    const wharf = await siteIdOf();
    const bytes = await jpeg({ size: 200 });
    const start = await engineer.json<{ photoId: string; uploadUrl: string }>(`/api/v1/sites/${wharf}/photos`, {
      method: "POST",
      body: { contentType: "image/jpeg", size: bytes.length },
    });
    expect(start.status).toBe(201);
    const put = await fetch(start.body.uploadUrl, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: new Uint8Array(bytes) });
    expect(put.ok).toBe(true);

    await stack.stopService(`${p.name}-s3`);
    try {
      const down = await engineer.json<ApiErr>(`/api/v1/photos/${start.body.photoId}/complete`, { method: "POST" });
      expect(down.status).toBe(503);
      expect(down.body.error.code).toBe("store_unavailable");
      expect(down.body.error.message).toMatch(/file store cannot be reached/);
      const [row] = await db.select({ status: photos.status, thumb: photos.thumbnailKey }).from(photos).where(eq(photos.id, start.body.photoId));
      expect(row).toEqual({ status: "pending", thumb: null }); // nothing half-done
    } finally {
      await stack.ensureS3(p);
    }
    const again = await engineer.json<{ photo: { status: string; thumbnailUrl: string } }>(`/api/v1/photos/${start.body.photoId}/complete`, { method: "POST" });
    expect(again.status).toBe(200);
    expect(again.body.photo.status).toBe("ready");
    expect((await fetch(again.body.photo.thumbnailUrl)).status).toBe(200);
  }, 60_000);

  it("a permit issued while the store is down is issued; its PDF is stored and e-mailed once the store is back", async () => {
    const wharf = (await site()).id;
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharf });
    await clearInbox();

    await stack.stopService(`${p.name}-s3`);
    let number: string;
    try {
      const issued = await post<{ permit: { status: string; numberLabel: string }; pdfReady: boolean } & ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
      expect(issued.status).toBe(200);
      expect(issued.body.permit.status).toBe("issued");
      expect(issued.body.pdfReady).toBe(false);
      number = issued.body.permit.numberLabel;
      // The e-mails wait for the PDF: none is sent without it.
      expect(await drainOutbox("store-down")).toBe(0);
      expect((await inbox()).filter((e) => e.subject.includes(number))).toHaveLength(0);
    } finally {
      await stack.ensureS3(p);
    }
    // What the worker does every 10 s, now that the store answers again.
    // (No grace period: the issuing request finished long ago.)
    const r = await renderPendingPermitPdfs({ olderThanSeconds: 0 });
    expect(r.failed).toEqual([]);
    expect(r.rendered).toBeGreaterThanOrEqual(1);
    await drainOutbox("store-back");
    const mails = await waitFor(async () => {
      const got = (await inbox()).filter((e) => e.subject.includes(number));
      return got.length >= 2 ? got : null; // every supervisor and the requester
    }, `the e-mails of ${number}`);
    for (const e of mails) expect(e.attachments.map((a) => a.contentType)).toContain("application/pdf");
    const perRecipient = new Map<string, number>();
    for (const e of mails) for (const to of e.to) perRecipient.set(to, (perRecipient.get(to) ?? 0) + 1);
    expect([...perRecipient.values()].every((n) => n === 1)).toBe(true);
    const res = await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("application/pdf");
  }, 60_000);
});

describe("the worker killed mid-delivery and started again", () => {
  it("loses no e-mail; the one in flight, if resent, carries the same Message-ID", async () => {
    await clearInbox();
    const marker = `Kill test ${Date.now()}`;
    const N = 120;
    await enqueueEmails(
      Array.from({ length: N }, (_, i) => ({ kind: "test", toEmail: `reader${i % 7}@demo.example`, subject: `${marker} #${i}`, text: `Message ${i} of ${N}.` })),
    );
    const ours = async () => (await inbox()).filter((e) => e.subject.startsWith(marker));
    const first = startWorker({ OUTBOX_POLL_MS: "200" });
    await waitFor(async () => (await ours()).length >= 15, "the first deliveries", 30_000);
    await kill(first.child, "SIGKILL");
    const atKill = (await ours()).length;
    expect(atKill).toBeLessThan(N); // it really died mid-delivery

    const second = startWorker({ OUTBOX_POLL_MS: "200" });
    await second.started();
    // Rows the dead worker had claimed stay leased for LOCK_SECONDS; a worker picks them up once the
    // lease runs out. Deliver with the clock past the lease, as the restarted worker would then.
    await waitFor(
      async () => {
        const [left] = await sql`select count(*)::int as n from outbox where subject like ${`${marker}%`} and status = 'queued'`;
        return left!.n === 0;
      },
      "the restarted worker to send everything unleased",
      60_000,
    );
    await kill(second.child);
    await drainOutbox("after-lease", new Date(Date.now() + 10 * 60_000));

    const delivered = await ours();
    const subjects = new Set(delivered.map((e) => e.subject));
    expect(subjects.size).toBe(N); // none lost
    expect(delivered.length).toBeLessThanOrEqual(N + 1); // at most the one in flight at the kill
    const idBySubject = new Map<string, string>();
    for (const e of delivered) {
      const id = (e as { messageId?: string }).messageId ?? "";
      expect(id).toMatch(/^<outbox\.[0-9a-f-]{36}@/);
      if (idBySubject.has(e.subject)) expect(idBySubject.get(e.subject)).toBe(id);
      idBySubject.set(e.subject, id);
    }
    const rows = await db.select({ status: outbox.status }).from(outbox).where(like(outbox.subject, `${marker}%`));
    expect(rows.every((r) => r.status === "sent")).toBe(true);
  }, 180_000);
});
