// The app cannot rewrite history: connected as the app's database account (DATABASE_URL, what the
// app runs as), MariaDB refuses schema changes, dropping the audit triggers, and any UPDATE or
// DELETE of an audit row, while the app's own write paths still work. The owner (DB_OWNER_USER)
// ran the migrations and defines every trigger; even it meets the append-only triggers.
import { QueryTypes, Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as newCustomer } from "@/app/api/customers/route";
import { APP_TABLE_RIGHTS } from "@/lib/server/core/db-rights";
import { APPEND_ONLY_MESSAGE } from "@/migrations/20261201001000-create-audit-events";
import { AuditEvent, Customer } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { closeOwnerDb, ownerDb } from "../support/owner-db";
import { asUser, call } from "../support/requests";

const app = new Sequelize(process.env.DATABASE_URL!, { dialect: "mariadb", logging: false });
const select = <T extends object>(db: Sequelize, sql: string, replacements: unknown[] = []) =>
  db.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const DENIED = /denied/i;

/** "UPDATE (`b`, `a`)" and "UPDATE (a, b)" alike: column lists without quotes, sorted; rights sorted. */
const normalRights = (rights: readonly string[]) =>
  rights
    .map((r) =>
      r.replace(/\((.*)\)/, (_, cols: string) => `(${cols.replace(/`/g, "").split(/,\s*/).sort().join(", ")})`),
    )
    .sort();

let s: TestShop;
let auditId: number;

beforeAll(async () => {
  s = await createShop();
  const res = await call(
    newCustomer,
    await asUser(s.users.lead, "POST", "/api/customers", { name: "Rights Test Marine", email: "", phone: "" }),
  );
  expect(res.status).toBe(201);
  auditId = (await AuditEvent.findOne({ where: { shopId: s.shop.id, action: "customer.create" } }))!.id;
});

afterAll(async () => {
  await app.close();
  await closeOwnerDb();
});

describe("the app's database account", () => {
  it("is the account the app runs as, and not the owner", async () => {
    const [{ who }] = await select<{ who: string }>(app, "SELECT CURRENT_USER() AS who");
    expect(who.split("@")[0]).toBe(decodeURIComponent(new URL(process.env.DATABASE_URL!).username));
    expect(who.split("@")[0]).not.toBe(process.env.DB_OWNER_USER);
  });

  it("holds exactly its table rights: no schema-wide grant, SELECT and INSERT on audit_events", async () => {
    const lines = (await select<Record<string, string>>(app, "SHOW GRANTS FOR CURRENT_USER()")).map(
      (r) => Object.values(r)[0],
    );
    const held: Record<string, string[]> = {};
    for (const line of lines) {
      const m = /^GRANT (.+) ON `[^`]+`\.`([^`]+)` TO /.exec(line);
      if (m) held[m[2]] = normalRights(m[1].split(/,\s*(?![^()]*\))/));
      else expect(line).toMatch(/^GRANT USAGE ON \*\.\* TO /);
    }
    const expected = Object.fromEntries(Object.entries(APP_TABLE_RIGHTS).map(([t, r]) => [t, normalRights(r)]));
    expect(held).toEqual(expected);
    expect(held.audit_events).toEqual(["INSERT", "SELECT"]);
  });

  it.each([
    ["drop an audit trigger", "DROP TRIGGER audit_events_no_delete"],
    ["drop the other audit trigger", "DROP TRIGGER audit_events_no_update"],
    [
      "put a trigger of its own on the audit trail",
      "CREATE TRIGGER audit_events_sneak BEFORE INSERT ON audit_events FOR EACH ROW SET NEW.action = 'x'",
    ],
    ["alter the audit trail", "ALTER TABLE audit_events ADD COLUMN hidden INT NULL"],
    ["alter another table", "ALTER TABLE readings DROP COLUMN note"],
    ["drop a table", "DROP TABLE audit_events"],
    ["empty the audit trail", "TRUNCATE TABLE audit_events"],
    ["create a table", "CREATE TABLE audit_events_copy (id INT)"],
    ["update an audit row", "UPDATE audit_events SET action = 'release.forged' WHERE id = ?"],
    ["delete an audit row", "DELETE FROM audit_events WHERE id = ?"],
    ["grant itself more", "GRANT UPDATE, DELETE ON audit_events TO CURRENT_USER()"],
    ["delete a reading (nothing of the app deletes readings)", "DELETE FROM readings WHERE id = ?"],
    ["delete a release", "DELETE FROM releases WHERE id = ?"],
  ])("cannot %s", async (_what, sql) => {
    await expect(app.query(sql, { replacements: sql.includes("?") ? [auditId] : [] })).rejects.toThrow(DENIED);
  });

  it("leaves the audit row and the audit triggers as they were", async () => {
    const row = await AuditEvent.findByPk(auditId);
    expect(row!.action).toBe("customer.create");
    const owned = await select<{ name: string }>(
      ownerDb(),
      "SELECT trigger_name AS name FROM information_schema.triggers WHERE event_object_table = 'audit_events' " +
        "AND trigger_schema = DATABASE() ORDER BY name",
    );
    // The two guards, and the insert trigger that keeps each event's job (the audit trail's index key).
    expect(owned.map((t) => t.name)).toEqual(["audit_events_job", "audit_events_no_delete", "audit_events_no_update"]);
  });

  it("still writes through the app's own paths (a customer and its audit row were stored)", async () => {
    expect(await Customer.count({ where: { shopId: s.shop.id, name: "Rights Test Marine" } })).toBe(1);
    await app.query(
      "INSERT INTO audit_events (shop_id, action, entity_type, entity_id, created_at) VALUES (?,?,?,?,?)",
      {
        replacements: [s.shop.id, "rights.check", "shop", String(s.shop.id), new Date()],
      },
    );
    expect(await AuditEvent.count({ where: { shopId: s.shop.id, action: "rights.check" } })).toBe(1);
  });
});

describe("the owner's account", () => {
  it("defines every trigger, so they run with the owner's rights and not the app's", async () => {
    const [{ who }] = await select<{ who: string }>(ownerDb(), "SELECT CURRENT_USER() AS who");
    const definers = await select<{ definer: string }>(
      ownerDb(),
      "SELECT DISTINCT definer FROM information_schema.triggers WHERE trigger_schema = DATABASE()",
    );
    expect(definers).toEqual([{ definer: who }]);
  });

  it("meets the append-only triggers too: UPDATE and DELETE of an audit row fail, the row unchanged", async () => {
    const owner = ownerDb();
    const q = (sql: string) => owner.query(sql, { replacements: [auditId] });
    await expect(q("UPDATE audit_events SET action = 'release.forged' WHERE id = ?")).rejects.toThrow(
      APPEND_ONLY_MESSAGE,
    );
    await expect(q("DELETE FROM audit_events WHERE id = ?")).rejects.toThrow(APPEND_ONLY_MESSAGE);
    expect((await AuditEvent.findByPk(auditId))!.action).toBe("customer.create");
  });
});
