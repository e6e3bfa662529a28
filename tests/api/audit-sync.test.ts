// A sync upload in the audit trail: ONE "readings.sync" event per job per batch, on the job,
// listing each new reading once; the audit screen (GET /api/audit) shows it one line per reading.
// Figures are invented fixtures against tests/support/factories.ts INCH_LIMITS (bore 4.03 ± 0.0005 in).
import { beforeAll, describe, expect, it } from "vitest";
import { GET as audit } from "@/app/api/audit/route";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { later, push, reading } from "./sync-fixtures";

const TOP_A = "Cylinder 1 · top of bore · axis A (thrust)";

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
});

describe("readings.sync in the audit trail", () => {
  it("lists each reading of the batch on one line, found by the job filter", async () => {
    const bad = reading(s.job.id, "bore/1/top/A", 4.0312);
    expect((await push(s.users.machinist, [bad, reading(s.job.id, "bore/1/mid/A", 4.0301)], "tablet-3")).status).toBe(
      200,
    );
    const fix = reading(s.job.id, "bore/1/top/A", 4.0302, { supersedes: bad.id, takenAt: later(5) });
    expect((await push(s.users.machinist, [fix], "tablet-3")).status).toBe(200);

    const res = await call(audit, await asUser(s.users.lead, "GET", `/api/audit?job=${s.job.id}&action=readings.sync`));
    expect(res.status).toBe(200);
    const [second, first] = res.body.events;
    expect(res.body.total).toBe(2);
    expect(first).toMatchObject({
      entityType: "job",
      entityId: String(s.job.id),
      jobCode: s.job.code,
      userName: s.users.machinist.name,
      truncated: false,
    });
    expect(first.changes).toEqual([
      { path: "device", label: "Tablet", kind: "added", before: null, after: "tablet-3 · 2 readings" },
      {
        path: "bore/1/top/A",
        label: TOP_A,
        kind: "added",
        before: null,
        after: `4.0312 in · out of spec · reading ${bad.id}`,
      },
      {
        path: "bore/1/mid/A",
        label: "Cylinder 1 · middle of bore · axis A (thrust)",
        kind: "added",
        before: null,
        after: expect.stringMatching(/^4\.0301 in · in spec · reading /),
      },
    ]);
    expect(second.changes[1]).toEqual({
      path: "bore/1/top/A",
      label: TOP_A,
      kind: "added",
      before: null,
      after: `4.0302 in · in spec · reading ${fix.id} (corrects ${bad.id})`,
    });
  });
});
