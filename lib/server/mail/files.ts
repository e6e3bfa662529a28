import "server-only";
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { env } from "@/lib/server/core/env";
import { AppError, notFound } from "@/lib/server/core/errors";
import type { MailFile } from "@/lib/schemas/mail";

// The development mailbox: the .eml files the local fake SMTP server saved in MAIL_DIR, read
// with mailparser, for the admin mail page. Only messages Tenthwise sent for this shop (the
// X-Tenthwise-Shop header) are shown, so one shop's admin never reads another shop's mail.
// MAIL_DIR is chosen at run time and lies outside the app, so its reads are marked for Turbopack to
// leave untraced (turbopackIgnore): tracing them would copy the whole project into the server output.
const FILE_NAME = /^[A-Za-z0-9._-]+\.eml$/;
const SCAN_LIMIT = 300;

export function mailDir(): string | null {
  return env().MAIL_DIR ?? null;
}

type Parsed = Awaited<ReturnType<typeof import("mailparser").simpleParser>>;

async function parseFile(dir: string, file: string): Promise<Parsed> {
  // mailparser is loaded only when the development mailbox is used.
  const { simpleParser } = await import("mailparser");
  return simpleParser(await readFile(/*turbopackIgnore: true*/ join(dir, file)));
}

const header = (m: Parsed, name: string) => {
  const v = m.headers.get(name);
  return typeof v === "string" ? v : v === undefined ? null : String(v);
};

function toFile(file: string, m: Parsed): MailFile {
  const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(", ") : (m.to?.text ?? "");
  return {
    file,
    to,
    subject: m.subject ?? "(no subject)",
    date: m.date ? m.date.toISOString() : null,
    kind: header(m, "x-tenthwise-kind"),
    attachments: m.attachments.map((a, index) => ({
      index,
      filename: a.filename ?? `attachment-${index + 1}`,
      contentType: a.contentType,
      size: a.size,
    })),
    text: m.text ?? "",
  };
}

/** The shop's messages in the mailbox, newest first (the fake names files by their arrival time). */
export async function listMailFiles(shopId: number, limit = 50): Promise<MailFile[] | null> {
  const dir = mailDir();
  if (!dir) return null;
  const names = (await readdir(/*turbopackIgnore: true*/ dir).catch(() => [] as string[]))
    .filter((n) => FILE_NAME.test(n))
    .sort()
    .reverse()
    .slice(0, SCAN_LIMIT);
  const out: MailFile[] = [];
  for (const name of names) {
    if (out.length >= limit) break;
    const m = await parseFile(dir, name).catch(() => null);
    if (m && header(m, "x-tenthwise-shop") === String(shopId)) out.push(toFile(name, m));
  }
  return out;
}

/** One attachment of one of the shop's messages; 404 for a file of another shop or none at all. */
export async function mailAttachment(
  shopId: number,
  file: string,
  index: number,
): Promise<{ filename: string; contentType: string; content: Buffer }> {
  const dir = mailDir();
  if (!dir) throw new AppError("not_found", "The local mailbox is off: MAIL_DIR is not set");
  if (!FILE_NAME.test(file)) throw notFound("Message");
  const m = await parseFile(dir, file).catch(() => null);
  if (!m || header(m, "x-tenthwise-shop") !== String(shopId)) throw notFound("Message");
  const a = m.attachments[index];
  if (!a) throw notFound("Attachment");
  return { filename: a.filename ?? `attachment-${index + 1}`, contentType: a.contentType, content: a.content };
}
