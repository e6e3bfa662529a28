// A copied release signs its own job: seal-worker.ts takes the copy's own hash and digests and
// stores its own build record (PDF and SHA-256), as a real signature does, in a few processes at
// once (one a core: the record's drawing is CPU work on one JavaScript thread each). The audit
// trail is append-only, so each copy's release.sign event is held back (isSignEvent) and written
// here, once the workers are done, naming the copy's own hash.
import { spawn } from "node:child_process";
import { availableParallelism } from "node:os";
import type { Connection } from "mariadb";
import type { Row } from "./clone";
import type { BulkWriter } from "./writer";

const PROCESSES = Number(process.env.TW_SCALE_SEAL_PROCESSES ?? Math.min(4, availableParallelism()));

export const isSignEvent = (a: Row) => a.action === "release.sign";

const parsed = (v: unknown) => (typeof v === "string" ? JSON.parse(v) : v) as Record<string, unknown>;

/** One sealing process over its share of the releases from id `from`; resolves when it ends well. */
function sealPart(from: number, part: number, parts: number): Promise<void> {
  const script = ["--tsconfig", "scripts/bench/tsconfig.sync.json", "scripts/bench/scale/seal-worker.ts"];
  const child = spawn(process.execPath, ["node_modules/tsx/dist/cli.mjs", ...script], {
    stdio: "inherit",
    env: {
      ...process.env,
      TW_SEAL_FROM: String(from),
      TW_SEAL_PART: String(part),
      TW_SEAL_PARTS: String(parts),
    },
  });
  return new Promise((resolve, reject) => {
    child.on("error", reject);
    child.on("exit", (code) =>
      code === 0 ? resolve() : reject(new Error(`Sealing process ${part + 1}/${parts} ended with ${code}`)),
    );
  });
}

/** Seals every copied release (ids from `from`), then writes each one's release.sign event. */
export async function sealReleases(conn: Connection, from: number, signEvents: Row[], writer: BulkWriter) {
  const parts = Math.max(1, PROCESSES);
  await Promise.all(Array.from({ length: parts }, (_, part) => sealPart(from, part, parts)));
  const sealed = (await conn.query("SELECT id, hash, record_sha256 FROM releases WHERE id >= ? ORDER BY id", [
    from,
  ])) as Row[];
  const eventOf = new Map(signEvents.map((a) => [String(a.entity_id), a]));
  const events = sealed.map((r) => {
    if (!r.record_sha256) throw new Error(`Release ${String(r.id)} was sealed without its stored record`);
    const event = eventOf.get(String(r.id));
    if (!event) throw new Error(`No release.sign event was copied for release ${String(r.id)}`);
    return { ...event, after: JSON.stringify({ ...parsed(event.after), hash: r.hash }) };
  });
  await writer.add("audit_events", events);
  await writer.finish(["audit_events"]);
  return { releases: sealed.length, processes: parts };
}
