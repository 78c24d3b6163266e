// With the mail server down, alert e-mails wait in the outbox; after it comes back every one of
// them is delivered — counted, nothing lost, nothing twice.
import { afterAll, describe, expect, it } from "vitest";
import { and, eq, inArray, like } from "drizzle-orm";
import { db, sql } from "@/db";
import { outbox, outboxAttempts } from "@/db/schema";
import { deliverDueEmails } from "@/lib/jobs/outbox";
import { runAlertScans } from "@/lib/alerts/scans";
import { makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { inbox } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

type Stack = {
  profile: (name: string) => { name: string };
  stopService: (name: string) => Promise<void>;
  ensureMailCatcher: (p: unknown) => Promise<void>;
};
// A plain .mjs module without types; the path is literal for the bundler.
const stack = (await import("../../scripts/stack.mjs" as string)) as Stack;
const p = stack.profile("test");

afterAll(async () => {
  await stack.ensureMailCatcher(p);
  await drainOutbox("alerts-delivery-cleanup", new Date(Date.now() + 2 * 3600_000));
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

describe("delivery while the mail server is down", () => {
  it("queues alert e-mails, retries with back-off, and delivers every one after the server returns", async () => {
    const fx = await makeAlertsOrg({ label: "smtp-down" });
    const loaded = await fx.addMember({ tag: "DN-L", status: "loaded" });
    await fx.addPermit({ memberIds: [loaded.id], validUntil: new Date(Date.now() - 60_000), number: 4 });
    for (let i = 1; i <= 3; i++) await fx.addMember({ tag: `DN-OVL-${i}`, loadN: 45_000 });
    const due = await fx.addMember({ tag: "DN-DUE", zone: "B" });
    await fx.addInspection({ memberId: due.id, at: new Date(Date.now() - 9 * 86_400_000) });

    await stack.stopService(`${p.name}-mail`);
    const now = new Date();
    const r = await runAlertScans({ siteIds: [fx.site.id], now });
    expect(r).toMatchObject({ overloads: 3, permits: 1, inspections: 1 });
    const ours = await db.select({ id: outbox.id }).from(outbox).where(and(eq(outbox.siteId, fx.site.id), like(outbox.kind, "alert:%")));
    // Manager and coordinator × (overloads, expiry, overdue inspection) = 6 e-mails.
    expect(ours).toHaveLength(6);
    const ids = ours.map((o) => o.id);

    // First try (a moment after the e-mails were written): every send fails and is kept for a retry 15 s later.
    const sendAt = new Date(Date.now() + 1000);
    for (let i = 0; i < 5; i++) if ((await deliverDueEmails({ worker: "down-1", limit: 50, now: sendAt })).claimed === 0) break;
    let rows = await db.select().from(outbox).where(inArray(outbox.id, ids));
    expect(rows.every((o) => o.status === "queued" && o.attempts === 1 && o.lastError)).toBe(true);
    expect(rows.every((o) => o.nextAttemptAt.getTime() >= sendAt.getTime() + 13_000)).toBe(true);
    // Not due again yet: nothing is claimed at the same moment.
    expect((await deliverDueEmails({ worker: "down-1", limit: 50, now: sendAt })).claimed).toBe(0);
    // Still down 20 s later: a second failed attempt each, back-off doubles.
    const t2 = new Date(sendAt.getTime() + 20_000);
    for (let i = 0; i < 5; i++) if ((await deliverDueEmails({ worker: "down-2", limit: 50, now: t2 })).claimed === 0) break;
    rows = await db.select().from(outbox).where(inArray(outbox.id, ids));
    expect(rows.every((o) => o.status === "queued" && o.attempts === 2)).toBe(true);
    const failedAttempts = await db.select().from(outboxAttempts).where(inArray(outboxAttempts.outboxId, ids));
    expect(failedAttempts.filter((a) => !a.ok)).toHaveLength(12);

    // The server is back; two workers drain once the back-off has passed.
    await stack.ensureMailCatcher(p);
    const later = new Date(now.getTime() + 5 * 60_000);
    await Promise.all([drainOutbox("up-1", later), drainOutbox("up-2", later)]);
    rows = await db.select().from(outbox).where(inArray(outbox.id, ids));
    expect(rows.map((o) => o.status)).toEqual(Array(6).fill("sent"));
    const mails = (await inbox()).filter((m) => m.to.includes(fx.people.manager.email) || m.to.includes(fx.people.coordinator.email));
    expect(mails).toHaveLength(6);
    expect(mails.filter((m) => m.to.includes(fx.people.manager.email)).map((m) => m.subject).sort()).toEqual(
      mails.filter((m) => m.to.includes(fx.people.coordinator.email)).map((m) => m.subject).sort(),
    );
  });
});
