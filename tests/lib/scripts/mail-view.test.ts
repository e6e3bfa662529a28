// The local mail view shows what the fake SMTP server saved: the list, and a message with its
// link clickable, text escaped.
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import nodemailer from "nodemailer";
import { afterAll, describe, expect, it } from "vitest";
import { startFakeSmtp } from "../../../scripts/lib/fakes.mjs";
import { startMailView } from "../../../scripts/lib/mail-view.mjs";
import { freePort } from "../../../scripts/lib/ports.mjs";

const stops: (() => Promise<unknown>)[] = [];
afterAll(async () => {
  for (const stop of stops) await stop();
});

describe("local mail view", () => {
  it("lists the saved messages and shows one with its link clickable and its text escaped", async () => {
    const mailDir = mkdtempSync(join(tmpdir(), "tw-mail-"));
    const smtp = await startFakeSmtp({ port: await freePort(), mailDir });
    const view = await startMailView({ port: await freePort(), mailDir });
    stops.push(smtp.stop, view.stop);
    const link = "http://localhost:3000/start/confirm/abc_DEF-123";
    await nodemailer.createTransport({ host: "127.0.0.1", port: smtp.port, secure: false, ignoreTLS: true }).sendMail({
      from: "shop@test.example",
      to: "ana@test.example",
      subject: "Confirm <yours>",
      text: `Open ${link}`,
    });

    const list = await (await fetch(view.url)).text();
    expect(list).toContain("ana@test.example");
    expect(list).toContain("Confirm &#60;yours&#62;");
    const href = /href="(\/m\/[^"]+)"/.exec(list)![1];
    const message = await (await fetch(`${view.url}${href}`)).text();
    expect(message).toContain(`<a href="${link}">${link}</a>`);
    expect((await fetch(`${view.url}/m/..%2F..%2Fetc%2Fpasswd`)).status).toBe(404);
  });
});
