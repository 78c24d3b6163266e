// Sending e-mail through nodemailer: the local SMTP catcher, or any SMTP provider in production.
// Only the worker calls sendMail; everything else writes to the outbox (db/queries/outbox.ts).
import "server-only";
import nodemailer from "nodemailer";
import { env } from "@/lib/env";

let transport: nodemailer.Transporter | null = null;

function getTransport() {
  transport ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: !env.SMTP_SECURE && env.SMTP_HOST === "127.0.0.1",
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return transport;
}

export type MailMessage = {
  /**
   * A stable Message-ID (from the outbox row): if a worker dies between the server's "accepted" and
   * recording it, the one message resent carries the same id, which mail systems treat as one.
   */
  messageId?: string;
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
};

export async function sendMail(msg: MailMessage) {
  const info = await getTransport().sendMail({
    from: env.MAIL_FROM,
    ...(msg.messageId ? { messageId: msg.messageId } : {}),
    to: msg.to,
    subject: msg.subject,
    text: msg.text,
    html: msg.html ?? undefined,
    attachments: msg.attachments,
  });
  return { messageId: info.messageId as string };
}
