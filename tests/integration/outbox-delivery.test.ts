// The outbox: e-mails written in a transaction are delivered by workers, once each.
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { inArray } from "drizzle-orm";
import { db, sql } from "@/db";
import { outbox, outboxAttempts } from "@/db/schema";
import { enqueueEmails } from "@/db/queries/outbox";
import { deliverDueEmails } from "@/lib/jobs/outbox";
import { putObject } from "@/lib/storage";
import { clearInbox, inbox } from "../support/http";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

beforeEach(async () => {
  await clearInbox();
});

describe("outbox delivery", () => {
  it("delivers a queued e-mail with its attachment from the store and records the attempt", async () => {
    const key = `test/outbox-${Date.now()}.pdf`;
    await putObject(key, Buffer.from("%PDF-1.4 test"), "application/pdf");
    const [row] = await enqueueEmails([
      { kind: "test", toEmail: "supervisor@demo.example", subject: "Outbox single", text: "body", attachments: [{ key, filename: "permit.pdf", contentType: "application/pdf" }] },
    ]);
    const r = await deliverDueEmails({ worker: "test-a" });
    expect(r.sent).toBeGreaterThanOrEqual(1);
    const mails = (await inbox()).filter((m) => m.subject === "Outbox single");
    expect(mails).toHaveLength(1);
    expect(mails[0]!.attachments).toEqual([expect.objectContaining({ filename: "permit.pdf", contentType: "application/pdf" })]);
    const attempts = await db.select().from(outboxAttempts).where(inArray(outboxAttempts.outboxId, [row!.id]));
    expect(attempts).toEqual([expect.objectContaining({ ok: true, worker: "test-a" })]);
  });

  it("two workers draining at once send each e-mail exactly once", async () => {
    const subjects = Array.from({ length: 30 }, (_, i) => `Concurrent ${Date.now()}-${i}`);
    const rows = await enqueueEmails(subjects.map((subject) => ({ kind: "test", toEmail: "manager@demo.example", subject, text: subject })));
    await Promise.all([
      deliverDueEmails({ worker: "w1", limit: 7 }),
      deliverDueEmails({ worker: "w2", limit: 7 }),
      deliverDueEmails({ worker: "w1", limit: 7 }),
      deliverDueEmails({ worker: "w2", limit: 7 }),
      deliverDueEmails({ worker: "w1", limit: 7 }),
    ]);
    const got = (await inbox()).filter((m) => subjects.includes(m.subject));
    expect(got).toHaveLength(30);
    expect(new Set(got.map((m) => m.subject)).size).toBe(30);
    const states = await db.select({ status: outbox.status }).from(outbox).where(inArray(outbox.id, rows.map((r) => r.id)));
    expect(states.every((s) => s.status === "sent")).toBe(true);
  });

  it("holds an e-mail that waits for its attachment", async () => {
    await enqueueEmails([{ kind: "test", toEmail: "engineer@demo.example", subject: "Held mail", text: "x", waitFor: "pdf:test" }]);
    await deliverDueEmails({ worker: "test-held" });
    expect((await inbox()).some((m) => m.subject === "Held mail")).toBe(false);
  });
});
