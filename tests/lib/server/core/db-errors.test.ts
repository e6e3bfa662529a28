import { afterEach, describe, expect, it, vi } from "vitest";
import {
  ConnectionAcquireTimeoutError,
  ConnectionRefusedError,
  DatabaseError,
  ForeignKeyConstraintError,
  TimeoutError,
  UniqueConstraintError,
  ValidationError,
  ValidationErrorItem,
} from "sequelize";
import { classifyDbError } from "@/lib/server/core/db-errors";
import { AppError, errorResponse } from "@/lib/server/core/errors";

// The driver's error as Sequelize wraps it. The message texts are MariaDB's own (its error message
// catalogue, share/errmsg-utf8.txt); tests/integration/db-errors.test.ts provokes the same errors on
// a real server, so a wording change there fails a test.
function sqlError(errno: number, sqlMessage: string, code = "ER_X") {
  return Object.assign(new Error(`(conn:1, no: ${errno}, SQLState: 22001) ${sqlMessage}`), {
    errno,
    sqlMessage,
    code,
    sql: "INSERT …",
  });
}
const wrapped = (errno: number, text: string) => new DatabaseError(sqlError(errno, text) as never);

afterEach(() => vi.restoreAllMocks());

describe("constraint failures name the field", () => {
  const cases: [string, unknown, string][] = [
    ["data too long (1406)", wrapped(1406, "Data too long for column 'note' at row 1"), "note"],
    ["out of range (1264)", wrapped(1264, "Out of range value for column 'dial_deviation' at row 1"), "dialDeviation"],
    ["truncated (1265)", wrapped(1265, "Data truncated for column 'unit_entered' at row 1"), "unitEntered"],
    [
      "incorrect string (1366), readings column mapped back to the API field",
      wrapped(1366, "Incorrect string value: '\\xED\\xA0\\x80' for column `tw`.`readings`.`value_entered` at row 1"),
      "value",
    ],
    ["NOT NULL (1048)", wrapped(1048, "Column 'name' cannot be null"), "name"],
    [
      "a column's own CHECK, e.g. JSON_VALID (4025)",
      wrapped(4025, "CONSTRAINT `build_plan` failed for `tw`.`jobs`"),
      "buildPlan",
    ],
    [
      "the audit trail's JSON is no one field (4025)",
      wrapped(4025, "CONSTRAINT `after` failed for `tw`.`audit_events`"),
      "_",
    ],
    [
      "foreign key (1452)",
      new ForeignKeyConstraintError({
        parent: sqlError(
          1452,
          "Cannot add or update a child row: a foreign key constraint fails (`tw`.`jobs`, CONSTRAINT `jobs_ibfk_2` " +
            "FOREIGN KEY (`customer_id`) REFERENCES `customers` (`id`) ON UPDATE CASCADE)",
        ) as never,
      }),
      "customerId",
    ],
    [
      "Sequelize's own model check",
      new ValidationError("notNull Violation", [
        new ValidationErrorItem(
          "Job.title cannot be null",
          "notnull violation",
          "title",
          "",
          null as never,
          "",
          "",
          [],
        ),
      ]),
      "title",
    ],
  ];
  it.each(cases)("%s", (_, err, field) => {
    const f = classifyDbError(err);
    expect(f).toMatchObject({ kind: "constraint", field });
  });

  it("a unique key answers 422 naming what is taken", async () => {
    const err = new UniqueConstraintError({
      parent: sqlError(1062, "Duplicate entry '1-AB12' for key 'jobs_shop_code'") as never,
      fields: { code: "AB12" },
    });
    vi.spyOn(console, "error").mockImplementation(() => {});
    const res = errorResponse(err);
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.code).toBe("invalid");
    expect(Object.values(body.error.fields).flat().join(" ")).toMatch(/already in use/);
  });

  it("answers 422 in the envelope and logs one line, without the values sent", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const res = errorResponse(wrapped(1264, "Out of range value for column 'dial_deviation' at row 1"));
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.fields).toEqual({ dialDeviation: [expect.stringMatching(/outside the range/)] });
    expect(body.error.message).toMatch(/^Dial reading: /);
    expect(log).toHaveBeenCalledTimes(1);
    const line = JSON.parse(String(log.mock.calls[0][0]));
    expect(line).toMatchObject({ event: "db_constraint", errno: 1264, column: "dial_deviation" });
  });
});

describe("outages answer 503 with Retry-After", () => {
  const outages: [string, unknown][] = [
    [
      "connection refused",
      new ConnectionRefusedError(Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" })),
    ],
    ["pool timeout", new ConnectionAcquireTimeoutError(new Error("Operation timeout"))],
    ["connection lost mid-query (driver 45009)", wrapped(45009, "socket has unexpectedly been closed")],
    ["server gone away (2006)", wrapped(2006, "MySQL server has gone away")],
    ["Galera node not ready (1047)", wrapped(1047, "WSREP has not yet prepared node for application use")],
    ["a raw driver error on the sync hot path", sqlError(45028, "retrieve connection from pool timeout after 10000ms")],
  ];
  it.each(outages)("%s", async (_, err) => {
    vi.spyOn(console, "error").mockImplementation(() => {});
    expect(classifyDbError(err)?.kind).toBe("outage");
    const res = errorResponse(err);
    expect(res.status).toBe(503);
    expect(res.headers.get("Retry-After")).toMatch(/^\d+$/);
    const body = await res.json();
    expect(body.error.code).toBe("unavailable");
    expect(body.error.retryAfter).toBe(Number(res.headers.get("Retry-After")));
  });

  it("a deadlock or lock wait left after the retries is not an outage", () => {
    expect(classifyDbError(new TimeoutError(sqlError(1213, "Deadlock found when trying to get lock") as never))).toBe(
      null,
    );
    vi.spyOn(console, "error").mockImplementation(() => {});
    expect(errorResponse(wrapped(1205, "Lock wait timeout exceeded")).status).toBe(500);
  });

  it("an AppError keeps its own status and envelope", async () => {
    const res = errorResponse(new AppError("not_found", "Job not found"));
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({ error: { code: "not_found", message: "Job not found" } });
  });
});
