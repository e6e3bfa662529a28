// Each constraint kind provoked on the real MariaDB, the error sorted by the one classifier the routes
// use, so the words MariaDB really sends (not our memory of them) are what name the field: every one
// answers 422 naming the API field, and none is taken for an outage. (Invalid UTF-8 does not fail
// here: this server stores "?" for it, so 1366 is covered by the unit test with MariaDB's wording.)
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { classifyDbError } from "@/lib/server/core/db-errors";
import { errorResponse } from "@/lib/server/core/errors";
import { Customer } from "@/models";
import { createShop, insertReading, type TestShop } from "../support/factories";
import { closeOwnerDb, ownerDb } from "../support/owner-db";

let a: TestShop;
let readingId: string;
beforeAll(async () => {
  a = await createShop();
  readingId = (await insertReading(a, "bore/1/top/A", 4.0302, 1)).id;
});
afterEach(() => vi.restoreAllMocks());
afterAll(() => closeOwnerDb());

// As the owner: some cases change columns the app's own account may not (a reading's figures, a
// customer), and its refusal would come first; the constraint's words are the same for both.
async function failure(sql: string, values: unknown[]): Promise<unknown> {
  try {
    await ownerDb().query(sql, { replacements: values });
  } catch (err) {
    return err;
  }
  throw new Error(`MariaDB took: ${sql}`);
}

describe("constraint failures on the real database", () => {
  const cases: [string, string, () => unknown[], string][] = [
    [
      "data too long (1406)",
      "UPDATE customers SET phone = REPEAT('9', 41) WHERE id = ?",
      () => [a.customer.id],
      "phone",
    ],
    [
      "out of range (1264)",
      "UPDATE engines SET nominal_bore = 10000000 WHERE id = ?",
      () => [a.engine.id],
      "nominalBore",
    ],
    [
      "out of range on a readings column, named by its API field (1264)",
      "UPDATE readings SET value_entered = 1000000000 WHERE id = ?",
      () => [readingId],
      "value",
    ],
    [
      "not one of the choices (1265)",
      "UPDATE engines SET layout = 'round' WHERE id = ?",
      () => [a.engine.id],
      "layout",
    ],
    ["JSON_VALID (4025)", "UPDATE jobs SET build_plan = 'not json' WHERE id = ?", () => [a.job.id], "buildPlan"],
    [
      "the audit trail's JSON names no one field (4025)",
      "INSERT INTO audit_events (shop_id, entity_type, entity_id, action, after) VALUES (?, 'job', '1', 'x', 'not json')",
      () => [a.shop.id],
      "_",
    ],
    ["foreign key (1452)", "UPDATE jobs SET customer_id = 2147480000 WHERE id = ?", () => [a.job.id], "customerId"],
    ["NOT NULL (1048)", "UPDATE customers SET name = NULL WHERE id = ?", () => [a.customer.id], "name"],
  ];

  it.each(cases)("%s", async (_, sql, values, field) => {
    const err = await failure(sql, values());
    expect(classifyDbError(err)).toMatchObject({ kind: "constraint", field });
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const res = errorResponse(err);
    expect(res.status).toBe(422);
    expect((await res.json()).error.fields).toHaveProperty([field]);
    expect(log).toHaveBeenCalledTimes(1);
  });

  it("a model write Sequelize refuses itself names the model's field", async () => {
    const err = await Customer.create({ shopId: a.shop.id, name: null as never }).catch((e: unknown) => e);
    expect(classifyDbError(err)).toMatchObject({ kind: "constraint", field: "name" });
  });
});
