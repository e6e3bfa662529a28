// TW_SCALE_KEEP=1: once bench:scale has printed its figures, the scaled database stays up and the
// production app serves it, so a person can open the flag queue, the jobs board and the audit
// trail on a million readings and download a signed record. Ctrl-C stops the app and the services
// and removes the data, as at the end of any bench:scale.
import { existsSync, readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { startServer, type MemorySubject } from "./memory";
import { BENCH_PASSWORD } from "./password";

export const keepWanted = () => process.env.TW_SCALE_KEEP === "1";

/** Serves the scaled database until SIGINT or SIGTERM. */
export async function serveUntilStopped(env: NodeJS.ProcessEnv, subjectFile: string): Promise<void> {
  if (!existsSync(subjectFile)) return console.log("bench:scale  nothing kept: the history was not loaded");
  const s = JSON.parse(readFileSync(subjectFile, "utf8")) as MemorySubject;
  const server = await startServer(env);
  const shop = s.leadEmail.split("@")[1];
  console.log(
    [
      `bench:scale  kept: the scaled database served at ${server.base} [load ${loadavg()[0].toFixed(1)}]`,
      `  sign in as lead@${shop} (flag queue, jobs board, audit trail; ${server.base}/desk/jobs/${s.jobId}),`,
      `  inspector@${shop}, admin@${shop}`,
      `  or machinist1@${shop}; every bench person's password is ${BENCH_PASSWORD} (benchmark data only).`,
      `  Every shop-N.bench.example (N = 1 to 20) has the same people. Ctrl-C stops the app and the database.`,
    ].join("\n"),
  );
  // Kept listening: tsx passes the terminal's SIGINT on a second time, and Node's default for it
  // would end this process before the services are stopped and their data removed.
  await new Promise<void>((resolve) => {
    process.on("SIGINT", () => resolve());
    process.on("SIGTERM", () => resolve());
  });
  console.log("bench:scale  stopping the app and the scaled database");
  await server.stop();
}
