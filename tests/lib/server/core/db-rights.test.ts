// The statements both accounts are set up with: every migrated table has its grant, the audit
// trail is append-only for the app, and names and passwords are quoted so they cannot break out.
import { describe, expect, it } from "vitest";
import { accountStatements, APP_TABLE_RIGHTS, appGrantStatements, parseAccount } from "@/lib/server/core/db-rights";
import { MIGRATED_TABLES } from "@/migrations";

const app = { user: "tenthwise", host: "127.0.0.1" };

describe("the app's table grants", () => {
  it("grant every migrated table and nothing else, one statement each", () => {
    const grants = appGrantStatements("tenthwise", app);
    expect(grants).toHaveLength(MIGRATED_TABLES.length);
    for (const table of MIGRATED_TABLES) {
      expect(
        grants.filter((g) => g.includes(` ON \`tenthwise\`.\`${table}\` TO 'tenthwise'@'127.0.0.1';`)),
      ).toHaveLength(1);
    }
  });

  it("leave the audit trail INSERT and SELECT only, and readings' figures and releases' signatures fixed", () => {
    expect(APP_TABLE_RIGHTS.readings.join(" ")).not.toMatch(/value|taken|station|unit/);
    expect(APP_TABLE_RIGHTS.releases.join(" ")).not.toMatch(/hash|signed|checklist/);
    expect(APP_TABLE_RIGHTS.audit_events).toEqual(["SELECT", "INSERT"]);
    expect(appGrantStatements("tw", app)).toContain(
      "GRANT SELECT, INSERT ON `tw`.`audit_events` TO 'tenthwise'@'127.0.0.1';",
    );
  });

  it("never hand out a schema right (only SELECT, INSERT, UPDATE, DELETE, table by table)", () => {
    for (const rights of Object.values(APP_TABLE_RIGHTS)) {
      // UPDATE may name its columns: a reading's figures and a signed release stay as they were.
      expect(rights.every((r) => /^(SELECT|INSERT|UPDATE|DELETE|UPDATE \([a-z0-9_, ]+\))$/.test(r))).toBe(true);
    }
    expect(appGrantStatements("tw", app).join("\n")).not.toMatch(/ALL|TRIGGER|ALTER|DROP|CREATE|\.\*/);
  });
});

describe("the administrator's account statements", () => {
  const plan = {
    databases: ["tenthwise"],
    owner: { user: "tenthwise_owner", host: "%", password: "o'wn\\er" },
    app: { user: "tenthwise", host: "%", password: "plain" },
  };

  it("create both accounts, strip the app, and give the owner the schema with GRANT OPTION", () => {
    const sql = accountStatements(plan);
    expect(sql).toContain("CREATE USER IF NOT EXISTS 'tenthwise'@'%' IDENTIFIED BY 'plain';");
    expect(sql).toContain("REVOKE ALL PRIVILEGES, GRANT OPTION FROM 'tenthwise'@'%';");
    expect(sql).toContain("GRANT ALL PRIVILEGES ON `tenthwise`.* TO 'tenthwise_owner'@'%' WITH GRANT OPTION;");
    expect(sql.filter((s) => s.startsWith("GRANT") && s.includes("TO 'tenthwise'@"))).toEqual([]);
  });

  it("quote a password holding a quote and a backslash (MariaDB string literal rules)", () => {
    expect(accountStatements(plan)).toContain(
      "CREATE USER IF NOT EXISTS 'tenthwise_owner'@'%' IDENTIFIED BY 'o''wn\\\\er';",
    );
  });

  it("read CURRENT_USER() back into user and host", () => {
    expect(parseAccount("tenthwise@127.0.0.1")).toEqual({ user: "tenthwise", host: "127.0.0.1" });
    expect(parseAccount("a@b@%")).toEqual({ user: "a@b", host: "%" });
  });
});
