// The local fake SMTP server's saved messages (MAIL_DIR, set by `npm test`), read back as a
// person would read their inbox.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function mailsTo(address: string): Promise<ParsedMail[]> {
  const dir = process.env.MAIL_DIR;
  if (!dir) throw new Error("MAIL_DIR is not set: run this test through npm test");
  const out: ParsedMail[] = [];
  for (const name of readdirSync(dir)
    .filter((n) => n.endsWith(".eml"))
    .sort()) {
    const m = await simpleParser(readFileSync(join(dir, name)));
    const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(",") : (m.to?.text ?? "");
    if (to.toLowerCase().includes(address.toLowerCase())) out.push(m);
  }
  // In the order they were queued (the outbox id), which file names and Date (to the second) miss.
  const order = (m: ParsedMail) => Number(m.headers.get("x-tenthwise-outbox-id") ?? 0);
  return out.sort((a, b) => order(a) - order(b));
}

/** The messages to an address once `n` have arrived, oldest first. */
export async function waitForMails(address: string, n: number, timeoutMs = 15_000): Promise<ParsedMail[]> {
  const until = Date.now() + timeoutMs;
  let mails = await mailsTo(address);
  while (mails.length < n && Date.now() < until) {
    await sleep(250);
    mails = await mailsTo(address);
  }
  if (mails.length < n) throw new Error(`Expected ${n} message(s) to ${address}, found ${mails.length}`);
  return mails;
}

/** The token of the last link to `page` in a message ("…/start/confirm/<token>"). */
export function linkToken(mail: ParsedMail, page: string): string {
  const found = [...(mail.text ?? "").matchAll(new RegExp(`${page}/([A-Za-z0-9_-]+)`, "g"))];
  if (!found.length) throw new Error(`No ${page} link in "${mail.subject}"`);
  return found[found.length - 1][1];
}

/** The whole link to `page` in a message and its token, e.g. linkIn(m, "/set-password"). */
export function linkIn(mail: ParsedMail, page: string): { url: string; token: string } {
  const escaped = page.replace(/[.*+?^${}()|[\]\\/]/g, "\\$&");
  const found = (mail.text ?? "").match(new RegExp(`https?://\\S+${escaped}/([A-Za-z0-9_-]+)`));
  if (!found) throw new Error(`No ${page} link in "${mail.subject}":\n${mail.text}`);
  return { url: found[0], token: found[1] };
}
