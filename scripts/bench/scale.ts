// `npm run bench:scale`: a million readings behind every office screen (issue 15). Starts a
// throwaway MariaDB and the fakes (scripts/lib/services.mjs), migrates, loads the history with
// the bulk loader (scripts/bench/scale/load.ts), then measures (scripts/bench/scale/run.ts), then
// the production server's peak memory over HTTP (scripts/bench/scale/memory.ts), and prints the
// build record's time (npm run bench:record).
// Every figure is printed with the load average: a busy machine's figures are not final.
import { execFileSync, spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { keepWanted, serveUntilStopped } from "./scale/keep";
import { measureServerMemory } from "./scale/memory";

type Lib = {
  startServices(o: Record<string, unknown>): Promise<{ env: Record<string, string>; stop(): Promise<void> }>;
  freePort(): Promise<number>;
};
const lib = (name: string) => `./lib/${name}.mjs`.replace("./lib", "../lib");

/** Runs a node child to its end while this process keeps serving the fakes; its exit status. */
function run(args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  const child = spawn(process.execPath, args, { stdio: "inherit", env });
  return new Promise((resolve, reject) => {
    child.on("error", reject);
    child.on("exit", (code) => resolve(code ?? 1));
  });
}

async function main() {
  const { startServices } = (await import(lib("services"))) as Lib;
  const { freePort } = (await import(lib("ports"))) as Lib;
  const dataRoot = mkdtempSync(join(tmpdir(), "tenthwise-scale-"));
  const secrets = {
    SESSION_SECRET: randomBytes(32).toString("hex"),
    LINK_SECRET: randomBytes(32).toString("hex"),
    DB_APP_PASSWORD: randomBytes(12).toString("hex"),
    DB_OWNER_PASSWORD: randomBytes(12).toString("hex"),
  };
  const [dbPort, smtpPort, s3Port] = [await freePort(), await freePort(), await freePort()];
  const services = await startServices({ mode: "test", dataRoot, dbPort, smtpPort, s3Port, secrets });
  let status: number;
  try {
    const env = { ...process.env, ...services.env, ...secrets, NOTIFY_INTERVAL_SECONDS: "0" };
    execFileSync("node", ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "scripts/db-setup.ts"], {
      stdio: "inherit",
      env,
    });
    // Server modules import the "server-only" marker; the child maps it to a stub (tsconfig.sync.json).
    // Spawned without blocking: the fake S3 and SMTP run in this process and must answer the child
    // (the templates' signatures store their records).
    status = await run(
      ["node_modules/tsx/dist/cli.mjs", "--tsconfig", "scripts/bench/tsconfig.sync.json", "scripts/bench/scale/run.ts"],
      { ...env, NODE_ENV: "production", TW_DATA_ROOT: dataRoot },
    );
    if (status === 0 && !(await measureServerMemory(env, join(dataRoot, "scale-subject.json")))) status = 1;
    // The build record's time is helper bench:record's (no database; an in-memory full V8).
    console.log("bench:scale  the build record (npm run bench:record, 5 renders):");
    const record = spawnSync(process.execPath, ["node_modules/tsx/dist/cli.mjs", "scripts/bench/record.ts"], {
      stdio: "inherit",
      env: { ...process.env, TW_BENCH_RUNS: "5" },
    });
    status ||= record.status ?? 1;
    // TW_SCALE_KEEP=1: a person opens the screens on the scaled database (even when a figure missed).
    if (keepWanted()) await serveUntilStopped(env, join(dataRoot, "scale-subject.json"));
  } finally {
    await services.stop();
    rmSync(dataRoot, { recursive: true, force: true });
  }
  process.exit(status);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
