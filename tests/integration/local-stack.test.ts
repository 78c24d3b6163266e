// A round trip through each real service the product stands on: PostgreSQL, the S3 fake, the
// SMTP catcher, and the job queue.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { organisations } from "@/db/schema";
import { getObject, headObject, presignGet, presignPut, putObject, deleteObject } from "@/lib/storage";
import { sendMail } from "@/lib/mail";
import { startBoss } from "@/lib/jobs/queue";
import { clearInbox, inbox, waitFor } from "../support/http";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

describe("PostgreSQL", () => {
  it("holds the migrated schema and the demo organisations", async () => {
    const rows = await db.select({ name: organisations.name }).from(organisations).orderBy(organisations.name);
    expect(rows.map((r) => r.name)).toEqual(["Brackenfield Builders", "Larkfield Frame & Civils Ltd"]);
  });

  it("refuses to change or delete audit events (append-only in the database)", async () => {
    const [org] = await db.select({ id: organisations.id }).from(organisations).where(eq(organisations.slug, "larkfield"));
    const [row] = await sql`insert into audit_events (organisation_id, action, entity_type) values (${org!.id}, 'test', 'probe') returning id`;
    await expect(sql`update audit_events set action = 'changed' where id = ${row!.id}`).rejects.toThrow(/append-only/);
    await expect(sql`delete from audit_events where id = ${row!.id}`).rejects.toThrow(/append-only/);
    const [still] = await sql`select action from audit_events where id = ${row!.id}`;
    expect(still!.action).toBe("test");
  });
});

describe("S3 fake through the AWS SDK", () => {
  it("stores, reads back and deletes an object", async () => {
    const key = `test/round-trip-${Date.now()}.txt`;
    await putObject(key, "prop P07 photo placeholder", "text/plain");
    expect((await getObject(key)).toString()).toBe("prop P07 photo placeholder");
    expect(await headObject(key)).toMatchObject({ size: 26 });
    await deleteObject(key);
    expect(await headObject(key)).toBeNull();
  });

  it("accepts a browser-style upload to a presigned PUT URL and serves it from a presigned GET", async () => {
    const key = `test/presigned-${Date.now()}.bin`;
    const bytes = new Uint8Array([1, 2, 3, 4, 5, 250]);
    const put = await fetch(await presignPut(key, "application/octet-stream"), {
      method: "PUT",
      headers: { "content-type": "application/octet-stream" },
      body: bytes,
    });
    expect(put.status).toBe(200);
    const got = await fetch(await presignGet(key));
    expect(new Uint8Array(await got.arrayBuffer())).toEqual(bytes);
  });
});

describe("SMTP catcher", () => {
  it("receives a message with its attachment and lists it as JSON", async () => {
    await clearInbox();
    await sendMail({
      to: "supervisor@demo.example",
      subject: "Round trip check",
      text: "Hello from the test suite",
      attachments: [{ filename: "note.txt", content: Buffer.from("attached"), contentType: "text/plain" }],
    });
    const mail = await waitFor(async () => (await inbox()).find((m) => m.subject === "Round trip check"), "the e-mail");
    expect(mail.to).toEqual(["supervisor@demo.example"]);
    expect(mail.text).toContain("Hello from the test suite");
    expect(mail.attachments).toEqual([expect.objectContaining({ filename: "note.txt", contentType: "text/plain", size: 8 })]);
  });
});

describe("job queue", () => {
  it("runs a heartbeat job to completion", async () => {
    const boss = await startBoss();
    try {
      const seen: string[] = [];
      await boss.work("heartbeat", async (jobs) => {
        for (const j of jobs) seen.push(j.id);
      });
      const id = await boss.send("heartbeat", { from: "test" });
      await waitFor(async () => seen.includes(id!), "the heartbeat job");
      expect(seen).toContain(id);
    } finally {
      await boss.stop({ graceful: false, wait: true });
    }
  });
});
