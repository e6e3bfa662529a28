import "server-only";
import { utcDate } from "@/lib/server/core/sql-driver";
import type { LoadedFlag, StoredFlag } from "@/lib/server/flags/repo";

// A flag read straight on the driver (repo.ts's FLAG_SELECT: the flag's columns, then its job's as
// j_*, its disposer's name, its reading's as r_*, the reading's gauge as i_* and taker as t_*)
// turned into the shape the Sequelize reads gave: camelCase, Dates, nested job, reading and users.

type JobRef = NonNullable<LoadedFlag["job"]>;
const date = (v: unknown) => utcDate(v) as Date;
const num = (v: unknown) => v as number;

/** A row of repo.ts's FLAG_SELECT as a LoadedFlag. */
export function fromSql(r: Record<string, unknown>): LoadedFlag {
  return {
    id: num(r.id),
    shopId: num(r.shop_id),
    jobId: num(r.job_id),
    readingId: r.reading_id as string | null,
    derivedKey: r.derived_key as string | null,
    stationId: r.station_id as string,
    characteristic: r.characteristic as string,
    value: num(r.value),
    unit: r.unit as string,
    limitMin: r.limit_min as number | null,
    limitMax: r.limit_max as number | null,
    deviation: r.deviation as number | null,
    verdict: r.verdict as StoredFlag["verdict"],
    reason: r.reason as StoredFlag["reason"],
    state: r.state as StoredFlag["state"],
    disposition: r.disposition as StoredFlag["disposition"],
    operation: r.operation as string | null,
    dispositionReason: r.disposition_reason as string | null,
    disposedBy: r.disposed_by as number | null,
    disposedAt: utcDate(r.disposed_at),
    closedAt: utcDate(r.closed_at),
    closedByReadingId: r.closed_by_reading_id as string | null,
    judgedAt: utcDate(r.judged_at),
    jobCode: r.job_code as string | null,
    createdAt: date(r.created_at),
    updatedAt: date(r.updated_at),
    job:
      r.j_id == null
        ? undefined
        : {
            id: num(r.j_id),
            code: r.j_code as string,
            title: r.j_title as string,
            status: r.j_status as JobRef["status"],
            unitSystem: r.j_unit_system as JobRef["unitSystem"],
            lockedAt: utcDate(r.j_locked_at),
          },
    disposer: r.disposed_by == null || r.d_name == null ? null : { id: num(r.disposed_by), name: r.d_name as string },
    reading:
      r.r_id == null
        ? null
        : {
            id: r.r_id as string,
            takenAt: date(r.r_taken_at),
            instrumentId: r.r_instrument_id as number | null,
            takenBy: num(r.r_taken_by),
            instrument:
              r.i_id == null
                ? null
                : {
                    id: num(r.i_id),
                    label: r.i_label as string,
                    serial: r.i_serial as string,
                    calibrationDue: r.i_calibration_due as string | null,
                  },
            taker: r.t_id == null ? undefined : { id: num(r.t_id), name: r.t_name as string },
          },
  };
}
