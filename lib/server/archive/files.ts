import "server-only";
import { col, userName, type ArchiveFile } from "./columns";
import { GAUGES, GAUGE_STUDIES } from "./gauge-files";

// What the shop archive holds, file by file: each file's columns (header, SQL, kind of value), the
// tables it reads and the key its rows are ordered and paged by. docs/archive-format.md describes
// the same files for the people who read them; a column added here is added there.

export type { ArchiveFile, Column, Kind } from "./columns";

const PEOPLE: ArchiveFile = {
  name: "people.csv",
  from: "users x",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("person id", "x.id", "number"),
    col("name", "x.name"),
    col("e-mail", "x.email"),
    col("role", "x.role"),
    col("active", "x.active", "bool"),
    col("created at (UTC)", "x.created_at", "time"),
  ],
};

const JOBS: ArchiveFile = {
  name: "jobs.csv",
  from: "jobs x JOIN customers c ON c.id = x.customer_id JOIN engines e ON e.id = x.engine_id",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("job id", "x.id", "number"),
    col("job code", "x.code"),
    col("title", "x.title"),
    col("status", "x.status"),
    col("unit system", "x.unit_system"),
    col("due date", "x.due_date", "date"),
    col("customer", "c.name"),
    col("customer e-mail", "c.email"),
    col("customer phone", "c.phone"),
    col("engine", "e.description"),
    col("cylinders", "e.cylinders", "number"),
    col("layout", "e.layout"),
    col("engine nominal bore", "e.nominal_bore", "number"),
    col("engine nominal stroke", "e.nominal_stroke", "number"),
    col("engine unit system", "e.unit_system"),
    col("block serial", "e.block_serial"),
    col("crank serial", "e.crank_serial"),
    col("head serials", "e.head_serials"),
    col("fuel", "e.fuel"),
    col("notes", "x.notes"),
    col("spec revision", "x.spec_revision", "number"),
    col("build plan (JSON)", "x.build_plan", "json"),
    col("locked at (UTC)", "x.locked_at", "time"),
    col("created at (UTC)", "x.created_at", "time"),
    col("updated at (UTC)", "x.updated_at", "time"),
  ],
};

const READINGS: ArchiveFile = {
  name: "readings.csv",
  from: "readings x JOIN jobs j ON j.id = x.job_id LEFT JOIN instruments g ON g.id = x.instrument_id",
  shopColumn: "x.shop_id",
  key: ["x.job_id", "x.taken_at", "x.id"], // index readings_shop_job_taken_id
  columns: [
    col("reading id", "x.id"),
    col("job id", "x.job_id", "number"),
    col("job code", "j.code"),
    col("station", "x.station_id"),
    col("characteristic", "x.characteristic"),
    col("value as entered", "x.value_entered", "number"),
    col("unit as entered", "x.unit_entered"),
    col("value (mm or N·m)", "x.value_canonical", "number"),
    col("entry mode", "x.entry_mode"),
    col("dial setting", "x.dial_setting", "number"),
    col("dial deviation", "x.dial_deviation", "number"),
    col("gauge id", "x.instrument_id", "number"),
    col("gauge serial", "g.serial"),
    col("part temperature (°C)", "x.part_temp_c", "number"),
    col("gauge temperature (°C)", "x.gauge_temp_c", "number"),
    col("lubricant", "x.lubricant"),
    col("skipped", "x.skipped", "bool"),
    col("skip reason", "x.skip_reason"),
    col("note", "x.note"),
    col("taken by (person id)", "x.taken_by", "number"),
    col("taken by", userName("x.taken_by")),
    col("taken at (UTC, tablet clock)", "x.taken_at", "time"),
    col("received at (UTC, server clock)", "x.received_at", "time"),
    col("device", "x.device_id"),
    col("corrects reading id", "x.supersedes"),
    col("verdict", "x.verdict"),
    col("verdict note", "x.verdict_note"),
    col("min (unit as entered)", "x.limit_min", "number"),
    col("max (unit as entered)", "x.limit_max", "number"),
    col("deviation (unit as entered)", "x.deviation", "number"),
  ],
};

const FLAGS: ArchiveFile = {
  name: "flags.csv",
  from: "flags x JOIN jobs j ON j.id = x.job_id",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("flag id", "x.id", "number"),
    col("job id", "x.job_id", "number"),
    col("job code", "j.code"),
    col("reading id", "x.reading_id"),
    col("computed value", "x.derived_key"),
    col("station", "x.station_id"),
    col("characteristic", "x.characteristic"),
    col("value", "x.value", "number"),
    col("unit", "x.unit"),
    col("min", "x.limit_min", "number"),
    col("max", "x.limit_max", "number"),
    col("deviation", "x.deviation", "number"),
    col("verdict", "x.verdict"),
    col("reason", "x.reason"),
    col("state", "x.state"),
    col("latest decision", "x.disposition"),
    col("operation", "x.operation"),
    col("decision reason", "x.disposition_reason"),
    col("decided by (person id)", "x.disposed_by", "number"),
    col("decided at (UTC)", "x.disposed_at", "time"),
    col("closed at (UTC)", "x.closed_at", "time"),
    col("closed by reading id", "x.closed_by_reading_id"),
    col("opened at (UTC)", "x.created_at", "time"),
  ],
};

const DECISIONS: ArchiveFile = {
  name: "decisions.csv",
  from: "flag_dispositions x JOIN flags f ON f.id = x.flag_id JOIN jobs j ON j.id = f.job_id",
  shopColumn: "f.shop_id",
  key: ["x.id"],
  columns: [
    col("decision id", "x.id", "number"),
    col("flag id", "x.flag_id", "number"),
    col("job id", "f.job_id", "number"),
    col("job code", "j.code"),
    col("station", "f.station_id"),
    col("decision", "x.disposition"),
    col("operation", "x.operation"),
    col("reason", "x.reason"),
    col("decided by (person id)", "x.user_id", "number"),
    col("decided by", userName("x.user_id")),
    col("decided at (UTC)", "x.created_at", "time"),
  ],
};

const RELEASES: ArchiveFile = {
  name: "releases.csv",
  from: "releases x JOIN jobs j ON j.id = x.job_id",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("release id", "x.id", "number"),
    col("job id", "x.job_id", "number"),
    col("job code", "j.code"),
    col("inspector (person id)", "x.inspector_id", "number"),
    col("inspector", userName("x.inspector_id")),
    col("signed name as typed", "x.signed_name"),
    col("signed at (UTC)", "x.signed_at", "time"),
    col("fingerprint (SHA-256)", "x.hash"),
    col("fingerprint version", "x.canonical_version", "number"),
    col("voided at (UTC)", "x.voided_at", "time"),
    col("voided by (person id)", "x.voided_by", "number"),
    col("void reason", "x.void_reason"),
    col("checklist (JSON)", "x.checklist", "json"),
  ],
};

/** The audit trail, one JSON object per line (its before/after are JSON already). */
export const AUDIT: ArchiveFile = {
  name: "audit-events.jsonl",
  from: "audit_events x",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("id", "x.id", "number"),
    col("at", "x.created_at", "time"),
    col("personId", "x.user_id", "number"),
    col("action", "x.action"),
    col("entityType", "x.entity_type"),
    col("entityId", "x.entity_id"),
    col("before", "x.before", "json"),
    col("after", "x.after", "json"),
  ],
};

export const CSV_FILES: ArchiveFile[] = [PEOPLE, JOBS, READINGS, FLAGS, DECISIONS, RELEASES, GAUGES, GAUGE_STUDIES];
