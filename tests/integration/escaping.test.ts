// Stored text that contains HTML is shown as text — escaped on the page and in e-mails, literal in
// the PDF — never interpreted (OWASP ASVS 4.0.3 V5.3.1 output encoding for the context).
import { afterAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import { as, makeMember, pdfText, post, requestLoad, site } from "../support/fixtures";

const HOSTILE = `<img src=x onerror="alert(1)"><b>Keep bay 3 clear</b> & <script>alert("x")</script>`;

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

describe("text with HTML in it", () => {
  it("a member's notes show escaped on the member page", async () => {
    const wharf = (await site()).id;
    const m = await makeMember();
    const engineer = await as("engineer");
    const patch = await engineer.json(`/api/v1/members/${m.id}`, { method: "PATCH", body: { notes: HOSTILE } });
    expect(patch.status).toBe(200);
    const page = await engineer.fetch(`/sites/${wharf}/members/${m.id}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("&lt;b&gt;Keep bay 3 clear&lt;/b&gt;");
    expect(html).not.toContain('<img src=x onerror="alert(1)">');
    expect(html).not.toContain('<script>alert("x")</script>');
  });

  it("permit conditions stay text on the permit page, in the PDF and in the e-mail", async () => {
    const wharf = (await site()).id;
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharf });
    const issued = await post<{ permit: { numberLabel: string } }>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { conditions: HOSTILE });
    expect(issued.status).toBe(200);
    const label = issued.body.permit.numberLabel;

    const page = await (await as("coordinator")).fetch(`/sites/${wharf}/permits/${id}`);
    const html = await page.text();
    expect(html).toContain("&lt;script&gt;");
    expect(html).not.toContain('<script>alert("x")</script>');

    const pdf = await waitFor(async () => {
      const r = await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf`);
      return r.status === 200 ? r : null;
    }, "the permit PDF");
    const text = (await pdfText(await pdf.arrayBuffer())).replace(/\s+/g, " ");
    expect(text).toContain("<b>Keep bay 3 clear</b>"); // printed as typed, not as markup

    await drainOutbox("escaping");
    const mail = await waitFor(async () => (await inbox()).find((e) => e.subject.startsWith(`${label} issued`)), `the e-mail for ${label}`);
    const full = (await inbox()).find((e) => e.subject === mail.subject) as unknown as { html: string; text: string };
    expect(full.html).toContain("&#60;b&#62;Keep bay 3 clear&#60;/b&#62;");
    expect(full.html).not.toContain("<script>alert");
    expect(full.html).not.toContain("<img src=x");
    expect(full.text).toContain("<b>Keep bay 3 clear</b>"); // the plain-text part is plain text
  });
});
