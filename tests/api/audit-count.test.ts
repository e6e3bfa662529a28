// A long audit trail: the count stops a few thousand events past the page (the page says so with
// `more`), and a date range alone is paged newest first by the events' times.
import { beforeAll, describe, expect, it } from "vitest";
import { GET as audit } from "@/app/api/audit/route";
import { getSequelize } from "@/lib/server/core/db";
import { insertMany } from "@/lib/server/core/sql-insert";
import { COUNT_AHEAD } from "@/lib/server/log/repo";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let long: TestShop;
let dated: TestShop;
const list = async (shop: TestShop, query: string) =>
  call(audit, await asUser(shop.users.lead, "GET", `/api/audit?${query}`));

const COLUMNS = ["shop_id", "user_id", "action", "entity_type", "entity_id", "before", "after", "created_at"];
const event = (shop: TestShop, entityId: string, at: Date) => [
  shop.shop.id,
  shop.users.lead.id,
  "job.note",
  "job",
  entityId,
  null,
  JSON.stringify({ note: entityId }),
  at,
];

beforeAll(async () => {
  long = await createShop();
  dated = await createShop();
  const now = new Date();
  const rows = Array.from({ length: COUNT_AHEAD + 10 }, (_, i) => event(long, `n${i}`, now));
  await getSequelize().transaction(async (t) => {
    for (let i = 0; i < rows.length; i += 1000) await insertMany(t, "audit_events", COLUMNS, rows.slice(i, i + 1000));
    await insertMany(t, "audit_events", COLUMNS, [
      event(dated, "first", new Date("2026-03-01T09:00:00Z")),
      event(dated, "second", new Date("2026-03-02T23:59:59.500Z")),
      event(dated, "third", new Date("2026-03-03T00:00:00Z")),
    ]);
  });
}, 60_000);

describe("audit trail count and date range", () => {
  it("stops counting past the page and says there are more", async () => {
    const first = await list(long, "pageSize=25&page=1");
    expect(first.status).toBe(200);
    // Events of the shop's own setup come on top of the inserted ones.
    expect(first.body).toMatchObject({ total: COUNT_AHEAD, more: true, pages: COUNT_AHEAD / 25 });
    expect(first.body.events).toHaveLength(25);
    const second = await list(long, "pageSize=25&page=2");
    const all = second.body.total as number;
    expect(second.body.more).toBe(false);
    expect(all).toBeGreaterThanOrEqual(COUNT_AHEAD + 10);
    expect(all).toBeLessThanOrEqual(COUNT_AHEAD + 25);
    expect(second.body.pages).toBe(Math.ceil(all / 25));
  });

  it("pages a date range alone newest first, the end day included", async () => {
    const range = await list(dated, "from=2026-03-01&to=2026-03-02");
    expect(range.body).toMatchObject({ total: 2, more: false, pages: 1 });
    expect(range.body.events.map((e: { entityId: string }) => e.entityId)).toEqual(["second", "first"]);
    expect(range.body.events[0].at).toBe("2026-03-02T23:59:59.500Z");
    const later = await list(dated, "from=2026-03-02");
    expect(later.body.events.map((e: { entityId: string }) => e.entityId)).toEqual(["third", "second"]);
  });
});
