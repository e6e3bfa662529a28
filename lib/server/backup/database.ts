import "server-only";
import { spawn } from "node:child_process";
import { createReadStream } from "node:fs";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import { StringDecoder } from "node:string_decoder";
import { writeHashed, type Written } from "./files";

// The database half of a backup: Debian's mariadb-dump writes it, the mariadb client reads it back.
// Both get the account from an option file readable only by us, never from the command line.

export type DbConfig = { host: string; port: number; database: string; username: string; password: string };

const quote = (v: string | number) => `"${String(v).replace(/\\/g, "\\\\").replace(/"/g, '\\"')}"`;

async function withOptionFile<T>(db: DbConfig, run: (file: string) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(join(tmpdir(), "tenthwise-db-"));
  const file = join(dir, "client.cnf");
  const lines = ["[client]", `host=${quote(db.host)}`, `port=${quote(db.port)}`, "protocol=TCP"];
  lines.push(`user=${quote(db.username)}`, `password=${quote(db.password)}`);
  await writeFile(file, `${lines.join("\n")}\n`, { mode: 0o600 });
  try {
    return await run(file);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

function missingTool(tool: string) {
  return new Error(`${tool} was not found: install Debian's mariadb-client (apt-get install mariadb-client)`);
}

type Child = ReturnType<typeof spawn>;

/** The exit of a client program, with its own words when it fails. */
function finished(child: Child, tool: string, what: string): Promise<void> {
  let stderr = "";
  child.stderr?.on("data", (d: Buffer) => (stderr = (stderr + d.toString()).slice(-4000)));
  return new Promise((resolve, reject) => {
    child.once("error", (err: NodeJS.ErrnoException) => reject(err.code === "ENOENT" ? missingTool(tool) : err));
    child.once("close", (code) =>
      code === 0 ? resolve() : reject(new Error(`${what} failed (${tool} exit ${code}): ${stderr.trim()}`)),
    );
  });
}

export const DUMP_OPTIONS = ["--single-transaction", "--routines", "--triggers", "--hex-blob"];

/** A consistent dump (one InnoDB snapshot, no locks held on the app's tables) streamed to `path`. */
export function dumpDatabase(db: DbConfig, path: string): Promise<Written> {
  return withOptionFile(db, async (file) => {
    const args = [`--defaults-file=${file}`, ...DUMP_OPTIONS, "--default-character-set=utf8mb4", db.database];
    const child = spawn("mariadb-dump", args, { stdio: ["ignore", "pipe", "pipe"] });
    const done = finished(child, "mariadb-dump", `Dumping the database ${db.database}`);
    const written = writeHashed(child.stdout!, path).catch((err: Error) => err);
    await done; // the tool's own words first: a failed dump also breaks the file's stream
    const result = await written;
    if (result instanceof Error) throw result;
    return result;
  });
}

export async function dumpToolVersion(): Promise<string> {
  const child = spawn("mariadb-dump", ["--version"], { stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  child.stdout!.on("data", (d: Buffer) => (out += d.toString()));
  await finished(child, "mariadb-dump", "Asking mariadb-dump for its version");
  return out.trim();
}

const DEFINER = /DEFINER=`(?:[^`]|``)*`@`(?:[^`]|``)*`/g;

/**
 * Drops the DEFINER of triggers and routines so they are created as the restoring account: the
 * account that dumped them may not exist on the server restored to. Row data is never touched.
 */
export function stripDefiners(line: string): string {
  return line.startsWith("INSERT INTO") ? line : line.replace(DEFINER, "");
}

function definerFilter(): Transform {
  const decoder = new StringDecoder("utf8");
  let rest = "";
  const out = (text: string) => text.split("\n").map(stripDefiners).join("\n");
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      const text = rest + decoder.write(chunk);
      const cut = text.lastIndexOf("\n");
      rest = text.slice(cut + 1);
      done(null, cut < 0 ? "" : out(text.slice(0, cut + 1)));
    },
    flush(done) {
      done(null, out(rest + decoder.end()));
    },
  });
}

/** Feeds a dump to the mariadb client, into the (emptied) database. */
export function loadDump(db: DbConfig, path: string): Promise<void> {
  return withOptionFile(db, async (file) => {
    const args = [`--defaults-file=${file}`, "--default-character-set=utf8mb4", db.database];
    const child = spawn("mariadb", args, { stdio: ["pipe", "ignore", "pipe"] });
    const done = finished(child, "mariadb", `Loading the dump into ${db.database}`);
    const fed = pipeline(createReadStream(path), definerFilter(), child.stdin!).catch((err: Error) => err);
    await done; // the client's words first: when it stops on an error, feeding it fails too
    const result = await fed;
    if (result instanceof Error) throw result;
  });
}
