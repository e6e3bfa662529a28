import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/server/core/env";

// Outgoing mail over SMTP (the local fake in development and tests, any SMTP server in
// production). Only the outbox worker calls sendMail; everything else enqueues (outbox.ts).
export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
  headers?: Record<string, string>;
};

const holder = globalThis as unknown as { __tenthwiseMail?: Transporter };

function transport(): Transporter {
  if (!holder.__tenthwiseMail) {
    const e = env();
    holder.__tenthwiseMail = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      ...(e.SMTP_USER ? { auth: { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? "" } } : {}),
      // A slow or dead server must fail the attempt (and be retried), not hang the worker.
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }
  return holder.__tenthwiseMail;
}

export async function sendMail(m: OutgoingMail): Promise<{ messageId: string }> {
  const info = await transport().sendMail({
    from: env().MAIL_FROM,
    to: m.to,
    subject: m.subject,
    text: m.text,
    ...(m.html ? { html: m.html } : {}),
    ...(m.attachments ? { attachments: m.attachments } : {}),
    headers: m.headers,
  });
  if (info.rejected?.length) throw new Error(`The mail server refused ${info.rejected.join(", ")}`);
  return { messageId: info.messageId };
}

const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ESCAPES[c]);

/** A plain HTML twin of a text body: paragraphs, and links made clickable. */
export function textToHtml(text: string): string {
  const paragraphs = text.split(/\n{2,}/).map((p) => {
    const lines = escapeHtml(p)
      .replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>')
      .split("\n")
      .join("<br>");
    return `<p>${lines}</p>`;
  });
  const style = "font-family:Helvetica,Arial,sans-serif;font-size:15px;line-height:1.45;color:#141b26";
  return `<div style="${style}">${paragraphs.join("\n")}</div>`;
}
