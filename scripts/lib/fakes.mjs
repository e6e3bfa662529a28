// Local stand-ins for hosted services, on loopback only: an SMTP server that saves each message
// as an .eml file (the admin mail view lists them), and an S3-compatible store (s3rver).
import { mkdirSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { randomUUID } from "node:crypto";

export async function startFakeSmtp({ port, mailDir }) {
  const { SMTPServer } = await import("smtp-server");
  mailDir = resolve(mailDir);
  mkdirSync(mailDir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      const chunks = [];
      stream.on("data", (c) => chunks.push(c));
      stream.on("end", () => {
        const name = `${new Date().toISOString().replace(/[:.]/g, "-")}-${randomUUID().slice(0, 8)}.eml`;
        writeFileSync(join(mailDir, name), Buffer.concat(chunks));
        callback();
      });
    },
  });
  await new Promise((res, rej) => {
    server.once("error", rej);
    server.listen(port, "127.0.0.1", res);
  });
  return { port, mailDir, stop: () => new Promise((res) => server.close(res)) };
}

export async function startFakeS3({ port, dir, bucket }) {
  const { default: S3rver } = await import("s3rver");
  dir = resolve(dir);
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({
    port,
    address: "127.0.0.1",
    directory: dir,
    silent: true,
    configureBuckets: [{ name: bucket }],
  });
  await server.run();
  return { endpoint: `http://127.0.0.1:${port}`, stop: () => server.close() };
}

/** The fake store `npm start` already runs on this port: used, never stopped. */
export async function attachFakeS3({ port }) {
  return { endpoint: `http://127.0.0.1:${port}`, stop: async () => {} };
}
