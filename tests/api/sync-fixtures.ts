// Shared by the sync, bench, ingest and reconcile tests: readings as the tablet sends them, and
// counts of what a batch wrote. Figures are invented test fixtures; the limits they are judged
// against are tests/support/factories.ts INCH_LIMITS (bore 4.03 +0.0005/−0.0005 in, taper and
// out-of-round ≤ 0.001 in, main oil clearance 0.0015–0.0025 in, torque 65–70 lbf·ft).
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { expect } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import type { PushReadingInput } from "@/lib/schemas/sync";
import { POST, GET } from "@/app/api/sync/route";
import { asUser, call } from "../support/requests";
import { gaugeFor, type TestUser } from "../support/factories";

export const TAKEN_AT = "2026-11-30T09:00:00.000Z";

export function reading(
  jobId: number,
  stationId: string,
  value: number | null,
  extra: Partial<PushReadingInput> = {},
): PushReadingInput {
  const torque = stationId.startsWith("torque/");
  return {
    id: randomUUID(),
    jobId,
    stationId,
    value,
    unit: torque ? "lbf_ft" : "in",
    entryMode: "direct",
    takenAt: TAKEN_AT,
    ...(torque ? { lubricant: "engine-oil" } : {}),
    ...extra,
  };
}

/** Takes later than TAKEN_AT by `minutes`, so a newer reading wins its station. */
export const later = (minutes: number) => new Date(Date.parse(TAKEN_AT) + minutes * 60_000).toISOString();

/**
 * Sends a batch as the tablet does. A reading with a value that names no gauge (no `instrumentId`
 * key at all) gets the test shop's gauge for its station, as the tablet proposes one; a test of the
 * refusal sets `instrumentId: undefined`.
 */
export async function push(user: TestUser | null, readings: unknown, deviceId: unknown = "tablet-test") {
  const withGauges = Array.isArray(readings) && user ? readings.map((r) => withGauge(user.shopId, r)) : readings;
  return call(POST, await asUser(user, "POST", "/api/sync", { deviceId, readings: withGauges }));
}

function withGauge(shopId: number, r: unknown): unknown {
  if (!r || typeof r !== "object" || "instrumentId" in r) return r;
  const { stationId, skipped } = r as { stationId?: unknown; skipped?: unknown };
  if (skipped || typeof stationId !== "string") return r;
  try {
    return { ...r, instrumentId: gaugeFor(shopId, stationId) };
  } catch {
    return r; // a station id the test sends to be refused
  }
}

export async function pull(user: TestUser | null, query: string) {
  return call(GET, await asUser(user, "GET", `/api/sync?${query}`));
}

export async function count(sql: string, replacements: unknown[]): Promise<number> {
  const [row] = await getSequelize().query<{ n: number }>(sql, { replacements, type: QueryTypes.SELECT });
  return Number(row.n);
}

/** Rows a job has in each table a batch writes to. */
export async function footprint(jobId: number, shopId: number) {
  return {
    readings: await count("SELECT COUNT(*) AS n FROM readings WHERE job_id = ?", [jobId]),
    flags: await count("SELECT COUNT(*) AS n FROM flags WHERE job_id = ?", [jobId]),
    changes: await count("SELECT COUNT(*) AS n FROM sync_changes WHERE job_id = ?", [jobId]),
    audits: await count("SELECT COUNT(*) AS n FROM audit_events WHERE shop_id = ?", [shopId]),
  };
}

export async function flagsOf(jobId: number) {
  return getSequelize().query<{
    id: number;
    readingId: string | null;
    derivedKey: string | null;
    stationId: string;
    state: string;
    reason: string;
    verdict: string;
    closedByReadingId: string | null;
    value: string | number;
  }>(
    `SELECT id, reading_id AS readingId, derived_key AS derivedKey, station_id AS stationId, state, reason, verdict,
       closed_by_reading_id AS closedByReadingId, value FROM flags WHERE job_id = ? ORDER BY id`,
    { replacements: [jobId], type: QueryTypes.SELECT },
  );
}

type SyncedEntry = {
  id: string;
  stationId: string;
  value: number | null;
  unit: string;
  verdict: string | null;
  supersedes: string | null;
};

/**
 * The readings listed by the shop's "readings.sync" audit events (one event per job per batch),
 * with the job and device each event names, in the order written.
 */
export async function syncedInAudit(shopId: number) {
  const rows = await getSequelize().query<{ userId: number; entityType: string; entityId: string; after: unknown }>(
    "SELECT user_id AS userId, entity_type AS entityType, entity_id AS entityId, `after` FROM audit_events " +
      "WHERE shop_id = ? AND action = 'readings.sync' ORDER BY id",
    { replacements: [shopId], type: QueryTypes.SELECT },
  );
  return rows.flatMap((r) => {
    const after = (typeof r.after === "string" ? JSON.parse(r.after) : r.after) as {
      jobId: number;
      deviceId: string;
      count: number;
      readings: SyncedEntry[];
    };
    expect(r.entityType).toBe("job");
    expect(Number(r.entityId)).toBe(after.jobId);
    expect(after.count).toBe(after.readings.length);
    return after.readings.map((e) => ({
      ...e,
      jobId: after.jobId,
      deviceId: after.deviceId,
      userId: Number(r.userId),
    }));
  });
}
