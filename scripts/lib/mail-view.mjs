// The local mail view: a small web page on loopback listing what the fake SMTP server saved
// (.data/mail), so a person trying Tenthwise on this machine can open a confirmation or
// invitation link without a real mailbox. Started by `npm start` only while the fake is in use;
// bound to 127.0.0.1, so only this machine sees it.
import { createServer } from "node:http";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";

const esc = (s) => String(s ?? "").replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
// Links in a message's text become clickable; everything else stays text.
const linkify = (text) => esc(text).replace(/https?:\/\/[^\s<]+/g, (u) => `<a href="${u}">${u}</a>`);

const page = (title, body) =>
  `<!doctype html><html lang="en"><meta charset="utf-8"><title>${esc(title)}</title>` +
  `<style>body{font:16px/1.5 system-ui,sans-serif;margin:2rem auto;max-width:60rem;padding:0 1rem}` +
  `td,th{padding:.4rem .6rem;border-bottom:1px solid #ccc;text-align:left}pre{white-space:pre-wrap}` +
  `a{color:#0a4f8a}</style><h1>${esc(title)}</h1>${body}</html>`;

async function listing(mailDir, simpleParser) {
  const names = readdirSync(mailDir)
    .filter((n) => n.endsWith(".eml"))
    .sort()
    .reverse();
  const rows = [];
  for (const name of names.slice(0, 200)) {
    const m = await simpleParser(readFileSync(join(mailDir, name)));
    rows.push(
      `<tr><td>${esc(m.date?.toISOString().slice(0, 19).replace("T", " "))}</td><td>${esc(m.to?.text)}</td>` +
        `<td><a href="/m/${encodeURIComponent(name)}">${esc(m.subject)}</a></td></tr>`,
    );
  }
  const table = rows.length
    ? `<table><tr><th>Sent (UTC)</th><th>To</th><th>Subject</th></tr>${rows.join("")}</table>`
    : "<p>No messages yet.</p>";
  return page("Local mail (development)", `<p>Messages the local fake mail server received, newest first.</p>${table}`);
}

async function message(mailDir, name, simpleParser) {
  if (!/^[\w.-]+\.eml$/.test(name)) return null;
  const m = await simpleParser(readFileSync(join(mailDir, name)));
  const files = (m.attachments ?? []).map((a) => esc(a.filename)).join(", ");
  return page(
    m.subject ?? "(no subject)",
    `<p><a href="/">All messages</a></p><p>To: ${esc(m.to?.text)}<br>From: ${esc(m.from?.text)}` +
      `${files ? `<br>Attached: ${files}` : ""}</p><pre>${linkify(m.text)}</pre>`,
  );
}

export async function startMailView({ port, mailDir }) {
  const { simpleParser } = await import("mailparser");
  const server = createServer(async (req, res) => {
    try {
      const path = decodeURIComponent(new URL(req.url ?? "/", "http://localhost").pathname);
      const html =
        path === "/" ? await listing(mailDir, simpleParser) : await message(mailDir, path.slice(3), simpleParser);
      res.writeHead(html ? 200 : 404, {
        "content-type": "text/html; charset=utf-8",
        "x-content-type-options": "nosniff",
      });
      res.end(html ?? page("Not found", '<p><a href="/">All messages</a></p>'));
    } catch (err) {
      res.writeHead(500, { "content-type": "text/plain; charset=utf-8" });
      res.end(`The local mail view could not read that message: ${err.message}`);
    }
  });
  await new Promise((ok, fail) => {
    server.once("error", fail);
    server.listen(port, "127.0.0.1", ok);
  });
  return { url: `http://localhost:${port}`, stop: () => new Promise((ok) => server.close(ok)) };
}
