// Every migration is reversible: all down leaves no table behind, all up builds every table, and
// each down restores exactly the schema that existed before its up. Also checks that the audit
// trail refuses UPDATE and DELETE.
//
// Runs on the harness's DATABASE_URL, which is already migrated and seeded and which later test
// files use. So the rows are parked in copy tables first (CREATE TABLE ... SELECT, inside the
// server, so no value changes on the way) and put back once the schema is up again.
import { QueryTypes, Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrator } from "@/lib/server/core/migrate";
import { APPEND_ONLY_MESSAGE } from "../../migrations/20261201001000-create-audit-events";
import { CONTEXT_TRIGGERS } from "../../migrations/20261202000200-add-jobs-context-revision";
import { SEQUENCE_TRIGGERS } from "../../migrations/20261204020000-add-sync-changes-seq";
import { PROGRESS_TRIGGERS } from "../../migrations/20261204050000-create-job-progress";
import { FLAG_KEY_TRIGGERS } from "../../migrations/20261205010000-add-flags-queue-keys";
import { MIGRATED_TABLES, migrations } from "../../migrations/index";

// npm test provides an empty scratch database for this file, so dropping every table never
// disturbs the seeded database the running app and the other tests use.
const url = process.env.TW_SCRATCH_DATABASE_URL ?? process.env.DATABASE_URL;
if (!url) throw new Error("TW_SCRATCH_DATABASE_URL must point at an empty test database (npm test sets it)");

const sequelize = new Sequelize(url, { dialect: "mariadb", logging: false });
// The app's own migrator, so this test shares the record of applied migrations with `npm start`.
const umzug = migrator(sequelize);
// Tables this test does not count as schema: umzug's record (the app's name and umzug's
// default) and the copies parked by this test.
const PARKED = "zz_migrations_test_";
const IGNORED = `table_name NOT IN ('schema_migrations', 'SequelizeMeta') AND table_name NOT LIKE '${PARKED}%'`;

async function select<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
  return sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

async function tableNames(): Promise<string[]> {
  const rows = await select<{ name: string }>(
    `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND ${IGNORED}`,
  );
  return rows.map((r) => r.name).sort(); // sorted here: the collation orders '_' differently
}

async function triggerNames(): Promise<string[]> {
  const rows = await select<{ name: string }>(
    "SELECT trigger_name AS name FROM information_schema.triggers WHERE trigger_schema = DATABASE()",
  );
  return rows.map((r) => r.name).sort();
}

/** The whole schema as text: every CREATE TABLE (minus the AUTO_INCREMENT counter) and trigger. */
async function schemaSnapshot(): Promise<string> {
  const parts: string[] = [];
  for (const name of await tableNames()) {
    const [row] = await select<Record<string, string>>(`SHOW CREATE TABLE \`${name}\``);
    parts.push(String(row["Create Table"]).replace(/ AUTO_INCREMENT=\d+/, ""));
  }
  const triggers = await select<{ name: string; timing: string; event: string; body: string }>(
    `SELECT trigger_name AS name, action_timing AS timing, event_manipulation AS event, action_statement AS body
     FROM information_schema.triggers WHERE trigger_schema = DATABASE() ORDER BY trigger_name`,
  );
  return [...parts, JSON.stringify(triggers)].join("\n");
}

/** Copies every migrated table's rows aside; returns the tables it copied. */
async function parkRows(): Promise<string[]> {
  const present = new Set(await tableNames());
  const parked: string[] = [];
  for (const table of MIGRATED_TABLES) {
    if (!present.has(table)) continue;
    await sequelize.query(`DROP TABLE IF EXISTS \`${PARKED}${table}\``);
    await sequelize.query(`CREATE TABLE \`${PARKED}${table}\` AS SELECT * FROM \`${table}\``);
    parked.push(table);
  }
  return parked;
}

/** Puts the parked rows back into the re-created tables (same columns, same order: see the test). */
async function restoreRows(parked: string[]): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    // Session setting, so the whole restore runs on the transaction's one connection.
    await sequelize.query("SET FOREIGN_KEY_CHECKS = 0", { transaction });
    // Children before parents: a job_limits row put back must not fire its trigger on a restored
    // job (it would give the job a new context_revision, and the checksums below would differ).
    for (const table of [...parked].reverse()) {
      await sequelize.query(`INSERT INTO \`${table}\` SELECT * FROM \`${PARKED}${table}\``, { transaction });
    }
    await sequelize.query("SET FOREIGN_KEY_CHECKS = 1", { transaction });
  });
  for (const table of parked) await sequelize.query(`DROP TABLE \`${PARKED}${table}\``);
}

/** A checksum of every row of `table`; equal schemas with equal rows give equal sums. */
async function checksum(table: string): Promise<string> {
  const [row] = await select<{ Checksum: unknown }>(`CHECKSUM TABLE \`${table}\``);
  return String(row.Checksum);
}

async function expectAppendOnlyRefusal(sql: string): Promise<void> {
  await expect(sequelize.query(sql)).rejects.toThrow(APPEND_ONLY_MESSAGE);
}

describe("migrations", () => {
  let parked: string[] = [];
  const checksums = new Map<string, string>();

  beforeAll(async () => {
    await sequelize.authenticate();
    await umzug.up(); // normally a no-op: the harness has migrated already
    for (const table of MIGRATED_TABLES) checksums.set(table, await checksum(table));
    parked = await parkRows();
  });

  afterAll(async () => {
    try {
      await umzug.down({ to: 0 }); // drop the rows this test wrote, whatever happened above
      await umzug.up();
      await restoreRows(parked);
    } finally {
      await sequelize.close();
    }
  });

  it("are named YYYYMMDDHHmmss-verb-noun, unique and in order", () => {
    const names = migrations.map((m) => m.name);
    for (const name of names) expect(name).toMatch(/^\d{14}-[a-z]+(-[a-z0-9]+)+$/);
    expect([...names].sort()).toEqual(names);
    expect(new Set(names).size).toBe(names.length);
  });

  it("all down removes every table and trigger", async () => {
    await umzug.down({ to: 0 });
    expect(await umzug.executed()).toEqual([]);
    expect(await tableNames()).toEqual([]);
    expect(await triggerNames()).toEqual([]);
  });

  it("all up creates every table, in utf8mb4, with the audit, context-revision and change-sequence triggers", async () => {
    await umzug.up();
    expect(await umzug.pending()).toEqual([]);
    expect(await tableNames()).toEqual([...MIGRATED_TABLES].sort());
    const collations = await select<{ name: string; collation: string }>(
      `SELECT table_name AS name, table_collation AS collation FROM information_schema.tables
       WHERE table_schema = DATABASE() AND ${IGNORED}`,
    );
    for (const c of collations) expect(c.collation, c.name).toMatch(/^utf8mb4_/);
    expect(await triggerNames()).toEqual(
      [
        "audit_events_no_delete",
        "audit_events_no_update",
        ...CONTEXT_TRIGGERS,
        ...SEQUENCE_TRIGGERS,
        ...PROGRESS_TRIGGERS,
        ...FLAG_KEY_TRIGGERS,
        "audit_events_job",
      ].sort(),
    );
  });

  it("audit_events refuses UPDATE and DELETE, and keeps the row", async () => {
    await sequelize.query("INSERT INTO shops (name, slug, unit_system) VALUES ('Audit Test Shop', 'audit-test', 'in')");
    const [shop] = await select<{ id: number }>("SELECT id FROM shops WHERE slug = 'audit-test'");
    await sequelize.query(
      "INSERT INTO audit_events (shop_id, action, entity_type, entity_id, `after`) VALUES (?, 'job.create', 'job', '1', '{\"a\":1}')",
      { replacements: [shop.id] },
    );
    await expectAppendOnlyRefusal("UPDATE audit_events SET action = 'job.delete'");
    await expectAppendOnlyRefusal("DELETE FROM audit_events");
    const rows = await select<{ action: string }>("SELECT action FROM audit_events WHERE shop_id = ?", [shop.id]);
    expect(rows).toEqual([{ action: "job.create" }]);
  });

  it("each down restores exactly the schema from before its up", async () => {
    await umzug.down({ to: 0 });
    for (const migration of migrations) {
      const before = await schemaSnapshot();
      await umzug.up({ step: 1 });
      const after = await schemaSnapshot();
      expect(after, `${migration.name} up changes nothing`).not.toEqual(before);
      await umzug.down({ step: 1 });
      expect(await schemaSnapshot(), `${migration.name} down`).toEqual(before);
      await umzug.up({ step: 1 });
      expect(await schemaSnapshot(), `${migration.name} up again`).toEqual(after);
    }
    expect(await umzug.pending()).toEqual([]);
  }, 120_000);

  it("parked rows go back unchanged (the harness's seed survives this file)", async () => {
    await umzug.down({ to: 0 });
    await umzug.up();
    await restoreRows(parked);
    for (const table of MIGRATED_TABLES) expect(await checksum(table), table).toBe(checksums.get(table));
    parked = await parkRows(); // afterAll restores once more, from this same copy
  });
});
