// Before a job's limits change is saved the lead sees what it will do: POST …/limits/preview runs
// the very save and rolls it back. Its counts must equal what the save then does, it must leave
// nothing behind, and a change that opens more than a handful of flags is saved only with that
// number confirmed. Figures are test fixtures against the factory's bore limit 4.0300 ± 0.0005 in.
import { beforeEach, describe, expect, it } from "vitest";
import { PUT } from "@/app/api/jobs/[jobId]/limits/route";
import { POST as PREVIEW } from "@/app/api/jobs/[jobId]/limits/preview/route";
import { WIDE_CHANGE_FLAGS } from "@/lib/domain";
import { AuditEvent, Flag, Job, Reading } from "@/models";
import { createShop, insertReading, INCH_LIMITS, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
type Limit = Record<string, unknown> & { characteristic: string };
const limits = (over: Record<string, Record<string, unknown>> = {}): Limit[] =>
  INCH_LIMITS.map((l) => ({ ...l, ...(over[l.characteristic] ?? {}) }));
const revision = async () => (await Job.findByPk(s.job.id))!.specRevision;
const send = async (route: unknown, method: string, suffix: string, list: Limit[], extra = {}, by?: TestUser) =>
  call(
    route as never,
    await asUser(by ?? s.users.lead, method, `/api/jobs/${s.job.id}/limits${suffix}`, {
      specRevision: await revision(),
      limits: list,
      ...extra,
    }),
    { jobId: String(s.job.id) },
  );
const preview = (list: Limit[], by?: TestUser) => send(PREVIEW, "POST", "/preview", list, {}, by);
const save = (list: Limit[], extra = {}) => send(PUT, "PUT", "", list, extra);
const unclosed = () => Flag.count({ where: { jobId: s.job.id, state: ["open", "disposed"] } });
const limitEdits = () => AuditEvent.count({ where: { action: "job_limits.update", entityId: String(s.job.id) } });

beforeEach(async () => {
  s = await createShop();
  // Eight bores in spec at 4.0302 in; the first save judges them.
  for (let c = 1; c <= 8; c++) await insertReading(s, `bore/${c}/top/A`, 4.0302, c);
  expect((await save(limits())).status).toBe(200);
});

describe("POST /api/jobs/[jobId]/limits/preview", () => {
  it("counts what tightening the bore would do, and leaves the job as it was", async () => {
    const [flags, rev, edits] = [await unclosed(), await revision(), await limitEdits()];
    // +0.0001 in: the maximum is 4.0301, so all eight bores go out of spec.
    const res = await preview(limits({ bore_diameter: { tolPlus: 0.0001 } }));
    expect(res.status).toBe(200);
    expect(res.body.consequences).toEqual({ flagsOpened: 8, flagsClosed: 0, verdictsChanged: 8, requiredStations: 8 });
    expect(res.body.words).toBe("opens 8 flags, changes 8 verdicts, affects 8 required stations");
    expect(res.body.wide).toBe(8 > WIDE_CHANGE_FLAGS);
    expect([await unclosed(), await revision(), await limitEdits()]).toEqual([flags, rev, edits]);
    const verdicts = (await Reading.findAll({ where: { jobId: s.job.id } })).map((r) => r.verdict);
    expect(new Set(verdicts)).toEqual(new Set(["in_spec"]));
  });

  it("a wide change is saved only with the number of flags it opens confirmed; then it does what the preview said", async () => {
    const tight = limits({ bore_diameter: { tolPlus: 0.0001 } });
    const said = (await preview(tight)).body.consequences;
    const refused = await save(tight);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain("opens 8 flags");
    expect(refused.body.error.fields.confirmedFlagsOpened[0]).toMatch(/Type 8/);
    expect((await save(tight, { confirmedFlagsOpened: 7 })).status).toBe(409);
    expect(await unclosed()).toBe(0);
    const saved = await save(tight, { confirmedFlagsOpened: 8 });
    expect(saved.status).toBe(200);
    expect(saved.body.consequences).toEqual(said);
    expect(saved.body.result).toMatchObject({ opened: 8, closed: 0 });
    expect(await unclosed()).toBe(8);
  });

  it("a narrow change saves without the second question, and the preview's counts match it", async () => {
    await save(limits({ bore_diameter: { tolPlus: 0.0001 } }), { confirmedFlagsOpened: 8 });
    const loose = limits({ bore_diameter: { tolPlus: 0.0008 } });
    const said = await preview(loose);
    expect(said.body).toMatchObject({
      wide: false,
      words: "closes 8 flags, changes 8 verdicts, affects 8 required stations",
    });
    const saved = await save(loose);
    expect(saved.status).toBe(200);
    expect(saved.body.consequences).toEqual(said.body.consequences);
    expect(await unclosed()).toBe(0);
  });

  it("refuses what the save refuses, on the field, in words", async () => {
    // A bore limit 13% under this engine's 4.03 in nominal bore, and a negative taper maximum.
    const far = await preview(limits({ bore_diameter: { nominal: 3.5 } }));
    expect(far.status).toBe(422);
    expect(far.body.error.fields["limits.0.nominal"][0]).toMatch(/10% away from this engine's 4.03 in bore/);
    expect((await save(limits({ bore_diameter: { nominal: 3.5 } }))).status).toBe(422);
    const taper = await preview(limits({ bore_taper: { max: -0.001 } }));
    expect(taper.status).toBe(422);
    expect(taper.body.error.fields["limits.1.max"][0]).toMatch(/cannot be negative/);
  });

  it("is for the lead of the job's shop only", async () => {
    expect((await preview(limits(), s.users.machinist)).status).toBe(403);
    expect((await preview(limits(), s.users.inspector)).status).toBe(403);
    const other = await createShop();
    expect((await preview(limits(), other.users.lead)).status).toBe(404);
  });
});
