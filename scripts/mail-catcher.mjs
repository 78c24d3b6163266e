// The SMTP catcher for local runs and tests: accepts every message on loopback, keeps it on
// disk, and shows the inbox as JSON (GET /api/email, newest first) and as a page for people.
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import http from "node:http";
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";

const smtpPort = Number(process.env.CATCHER_SMTP_PORT ?? 1025);
const httpPort = Number(process.env.CATCHER_HTTP_PORT ?? 1080);
const dir = process.env.CATCHER_DIR ?? ".data/mail";
fs.mkdirSync(dir, { recursive: true });

function list() {
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .map((f) => JSON.parse(fs.readFileSync(path.join(dir, f), "utf8")))
    .sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : b.seq - a.seq));
}

let seq = Date.now();
const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  size: 40 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks = [];
    stream.on("data", (c) => chunks.push(c));
    stream.on("end", async () => {
      try {
        const raw = Buffer.concat(chunks);
        const parsed = await simpleParser(raw);
        const id = `${Date.now()}-${crypto.randomBytes(4).toString("hex")}`;
        const addr = (a) => (a ? (Array.isArray(a) ? a : [a]).flatMap((x) => x.value.map((v) => v.address)) : []);
        const msg = {
          id,
          seq: seq++,
          to: session.envelope.rcptTo.map((r) => r.address),
          headerTo: addr(parsed.to),
          from: parsed.from?.value?.[0]?.address ?? session.envelope.mailFrom?.address ?? "",
          subject: parsed.subject ?? "",
          messageId: parsed.messageId ?? "",
          date: new Date().toISOString(),
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
          attachments: parsed.attachments.map((a, i) => ({
            index: i,
            filename: a.filename ?? `attachment-${i}`,
            contentType: a.contentType,
            size: a.size,
          })),
        };
        fs.writeFileSync(path.join(dir, `${id}.eml`), raw);
        parsed.attachments.forEach((a, i) => fs.writeFileSync(path.join(dir, `${id}.${i}.bin`), a.content));
        fs.writeFileSync(path.join(dir, `${id}.json`), JSON.stringify(msg));
        callback();
      } catch (err) {
        callback(err);
      }
    });
  },
});
smtp.on("error", (e) => console.error("smtp error", e.message));
smtp.listen(smtpPort, "127.0.0.1");

const esc = (s) => String(s).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

const web = http.createServer((req, res) => {
  const url = new URL(req.url, "http://x");
  if (url.pathname === "/api/email" && req.method === "GET") {
    res.writeHead(200, { "content-type": "application/json" });
    return res.end(JSON.stringify(list()));
  }
  if (url.pathname === "/api/email" && req.method === "DELETE") {
    for (const f of fs.readdirSync(dir)) fs.rmSync(path.join(dir, f), { force: true });
    res.writeHead(204);
    return res.end();
  }
  const att = url.pathname.match(/^\/api\/email\/([\w-]+)\/attachments\/(\d+)$/);
  if (att) {
    const meta = path.join(dir, `${att[1]}.json`);
    const file = path.join(dir, `${att[1]}.${att[2]}.bin`);
    if (!fs.existsSync(meta) || !fs.existsSync(file)) {
      res.writeHead(404);
      return res.end("not found");
    }
    const a = JSON.parse(fs.readFileSync(meta, "utf8")).attachments[Number(att[2])];
    res.writeHead(200, { "content-type": a.contentType, "content-disposition": `inline; filename="${a.filename}"` });
    return res.end(fs.readFileSync(file));
  }
  if (url.pathname === "/") {
    const rows = list()
      .map(
        (m) => `<article><h2>${esc(m.subject)}</h2><p class="meta">${esc(m.date)} · from ${esc(m.from)} · to ${esc(m.to.join(", "))}</p>
<pre>${esc(m.text)}</pre>${m.attachments
          .map((a) => `<p>📎 <a href="/api/email/${m.id}/attachments/${a.index}">${esc(a.filename)}</a> (${a.contentType}, ${a.size} bytes)</p>`)
          .join("")}</article>`,
      )
      .join("");
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" });
    return res.end(`<!doctype html><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>Local inbox</title>
<style>body{font:16px system-ui;margin:0 auto;max-width:60rem;padding:1rem;background:#f6f6f4}article{background:#fff;border:1px solid #bbb;border-radius:6px;padding:0 1rem 1rem;margin:1rem 0}pre{white-space:pre-wrap;font:14px ui-monospace,monospace}.meta{color:#444}</style>
<h1>Local inbox — every e-mail the app sent (newest first)</h1>${rows || "<p>No messages yet.</p>"}`);
  }
  res.writeHead(404);
  res.end("not found");
});
web.listen(httpPort, "127.0.0.1");
console.log(`SMTP catcher on 127.0.0.1:${smtpPort}, inbox on http://127.0.0.1:${httpPort}`);

const stop = () => {
  smtp.close(() => {});
  web.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
