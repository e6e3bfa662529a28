// Every migration is reversible: all down leaves no table behind, all up builds every table, and
// each down restores exactly the schema that existed before its up. Also checks that the audit
// trail refuses UPDATE and DELETE. Runs against the harness's DATABASE_URL (already migrated up)
// and leaves it migrated up again. It drops every table on the way, so it needs a database that
// no other test file uses at the same time.
import { QueryTypes, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { APPEND_ONLY_MESSAGE } from "../../migrations/20261201001000-create-audit-events";
import { MIGRATED_TABLES, migrations } from "../../migrations/index";

const url = process.env.DATABASE_URL;
if (!url) throw new Error("DATABASE_URL must point at the test database (the test harness sets it)");

const sequelize = new Sequelize(url, { dialect: "mariadb", logging: false });
const umzug = new Umzug({
  migrations,
  context: sequelize.getQueryInterface(),
  storage: new SequelizeStorage({ sequelize }),
  logger: undefined,
});

async function select<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
  return sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

async function tableNames(): Promise<string[]> {
  const rows = await select<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'SequelizeMeta'",
  );
  return rows.map((r) => r.name).sort(); // in JS: the collation orders '_' differently

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
    "SELECT trigger_name AS name, action_timing AS timing, event_manipulation AS event, action_statement AS body FROM information_schema.triggers WHERE trigger_schema = DATABASE() ORDER BY trigger_name",
  );
  return [...parts, JSON.stringify(triggers)].join("\n");
}

async function expectAppendOnlyRefusal(sql: string): Promise<void> {
  await expect(sequelize.query(sql)).rejects.toThrow(APPEND_ONLY_MESSAGE);
}

describe("migrations", () => {
  beforeAll(async () => {
    await sequelize.authenticate();
  });

  afterAll(async () => {
    await umzug.up(); // leave the database as the harness made it, whatever happened above
    await sequelize.close();
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
  }, 60_000);

  it("all up creates every table, in utf8mb4, with the audit triggers", async () => {
    await umzug.up();
    expect(await umzug.pending()).toEqual([]);
    expect(await tableNames()).toEqual([...MIGRATED_TABLES].sort());
    const collations = await select<{ name: string; collation: string }>(
      "SELECT table_name AS name, table_collation AS collation FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'SequelizeMeta'",
    );
    for (const c of collations) expect(c.collation, c.name).toMatch(/^utf8mb4_/);
    expect(await triggerNames()).toEqual(["audit_events_no_delete", "audit_events_no_update"]);
  }, 60_000);

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
  }, 60_000);

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
});
