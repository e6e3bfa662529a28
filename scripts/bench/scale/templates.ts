// One job's life through the real server code (benchmark data only): the machinist's readings go
// through the ingest of POST /api/sync in batches of 100, the lead decides flags through the
// disposition service, the machined sections are measured again, the inspector signs a finished
// job's release (the real signature, hash and stored record), and the job ends in its status.
// The rows this writes are what load.ts copies; tests/integration/scale-loader.test.ts compares.
import type { Connection } from "mariadb";
import type { PushReadingInput } from "@/lib/schemas/sync";
import type { Actor } from "@/lib/schemas/session";
import type { DispositionInput } from "@/lib/schemas/flag";
import { ingestBatch } from "@/lib/server/sync/ingest";
import { disposeFlag } from "@/lib/server/flags/disposition";
import { signRelease } from "@/lib/server/release/sign";
import { lcg, valueFor } from "../sync-readings";
import { BENCH_PASSWORD } from "./password";
import { isMachined, isSigned, passes, type GaugePick, type Variant } from "./variants";

const BATCH = 100;
export const BENCH_DEVICE = "bench-tablet-1";
const ACCEPT_REASON = "Within the engine maker's service limit for this build (benchmark data)";

export type ShopActors = { machinist: Actor; lead: Actor; inspector: Actor; gauge: GaugePick };

async function send(actor: Actor, readings: PushReadingInput[]) {
  for (let i = 0; i < readings.length; i += BATCH) {
    const reply = await ingestBatch(actor, { deviceId: BENCH_DEVICE, readings: readings.slice(i, i + BATCH) });
    if (reply.status !== 200)
      throw new Error(`The ingest refused a bench batch: ${JSON.stringify(reply.body).slice(0, 1500)}`);
  }
}

type OpenFlag = { id: number; stationId: string; state: string; disposition: string | null };

async function undecided(conn: Connection, jobId: number): Promise<OpenFlag[]> {
  return conn.query(
    `SELECT id, station_id AS stationId, state, disposition FROM flags
      WHERE job_id = ? AND state <> 'closed' AND (disposition IS NULL OR disposition <> 'accept') ORDER BY id`,
    [jobId],
  );
}

/** The lead's first look: machined stations go back to the machine, others alternate accept and measure again. */
function firstDecision(f: OpenFlag, i: number): DispositionInput {
  if (isMachined(f.stationId)) return { kind: "machine_again", operation: "hone", note: undefined };
  return i % 2 ? { kind: "accept", reason: ACCEPT_REASON } : { kind: "measure_again", note: undefined };
}

/**
 * Runs variant `v` on job `jobId` (status "measuring", no readings yet) and sets its final status.
 * `endAt` is when its last reading is taken (ms).
 */
export async function runVariant(conn: Connection, actors: ShopActors, jobId: number, v: Variant, endAt: number) {
  const { first, second } = passes(v, jobId, endAt, actors.gauge);
  await send(actors.machinist, first);
  const open = (await undecided(conn, jobId)).filter((f) => f.state === "open");
  const decided = open.slice(0, Math.round(v.decideShare * open.length));
  const again: string[] = [];
  for (const [i, f] of decided.entries()) {
    const d = firstDecision(f, i);
    await disposeFlag(actors.lead, f.id, d);
    if (d.kind === "measure_again") again.push(f.stationId);
  }
  if (v.secondPass) {
    // The stations sent back to be measured again are taken once more right after the machined ones.
    const rnd = lcg(v.seed + 1);
    const last = second.at(-1) ?? first.at(-1)!;
    // A derived value's flag is measured again through the readings it comes from, already retaken
    // when machined; a raw reading's station is taken once more.
    const retaken = first.filter((r) => again.includes(r.stationId));
    const remeasured = retaken.map((earlier, i) => {
      const stationId = earlier.stationId;
      const value = valueFor(stationId, rnd);
      return {
        ...earlier,
        id: crypto.randomUUID(),
        value,
        instrumentId: actors.gauge(stationId, value, earlier.unit),
        takenAt: new Date(Date.parse(last.takenAt) + (i + 1) * 20_000).toISOString(),
      };
    });
    await send(actors.machinist, [...second, ...remeasured]);
  }
  if (v.settle)
    for (const f of await undecided(conn, jobId))
      await disposeFlag(actors.lead, f.id, { kind: "accept", reason: ACCEPT_REASON });
  if (isSigned(v)) {
    // The inspector's e-signature (name and password again): the release, its hash, the stored record.
    const { inspector } = actors;
    await signRelease(inspector, jobId, { fullName: inspector.name, password: BENCH_PASSWORD }).catch((err) => {
      const told = JSON.stringify((err as { fields?: unknown }).fields ?? {});
      throw new Error(`The bench's signature was refused: ${String(err)} ${told.slice(0, 1500)}`);
    });
  }
  // The status a job ends in (the desk's status change); a signed job keeps the lock of its release.
  if (v.status !== "measuring" && v.status !== "released")
    await conn.query("UPDATE jobs SET status = ? WHERE id = ?", [v.status, jobId]);
}
