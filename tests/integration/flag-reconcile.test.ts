// reconcileJob after a limits edit (the re-evaluation path the lead's desk uses): verdicts flip,
// flags open and close exactly once, dispositions stay, audit shows before and after.
// Limits are tests/support/factories.ts INCH_LIMITS; expected verdicts follow ISO 14253-1
// (in spec, within U of a limit = marginal, beyond = out of spec; lib/domain/verdict.ts).
import { beforeEach, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/server/core/db";
import { reconcileJob } from "@/lib/server/reconcile/reconcile";
import { FlagDisposition, Flag } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { count, flagsOf, push, reading } from "../api/sync-fixtures";
import { asOwner } from "../support/owner-db";

let s: TestShop;
beforeEach(async () => {
  s = await createShop();
});

/** Edits one limit of the job and reconciles, in one transaction, as a limits edit does. */
async function editLimit(characteristic: string, patch: Record<string, number>) {
  // As the owner, before the app's transaction: the app itself replaces limits, it never updates one.
  const columns = Object.keys(patch).map((k) => `\`${k.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)}\` = ?`);
  await asOwner(`UPDATE job_limits SET ${columns.join(", ")} WHERE job_id = ? AND characteristic = ?`, [
    ...Object.values(patch),
    s.job.id,
    characteristic,
  ]);
  return getSequelize().transaction((t) =>
    reconcileJob(t, { shopId: s.shop.id, jobId: s.job.id, userId: s.users.lead.id, cause: "limits-edit" }),
  );
}

const verdictOf = async (id: string) =>
  (
    await getSequelize().query<{ verdict: string; limitMax: string }>(
      "SELECT verdict, limit_max AS limitMax FROM readings WHERE id = ?",
      { replacements: [id], type: QueryTypes.SELECT },
    )
  )[0];

describe("reconcileJob after a limits edit", () => {
  it("a tighter limit flips an in-spec reading to out of spec and opens its flag; loosening closes it", async () => {
    const r = reading(s.job.id, "bore/1/top/A", 4.0303);
    await push(s.users.machinist, [r]);
    expect(await flagsOf(s.job.id)).toEqual([]);

    const tight = await editLimit("bore_diameter", { tolPlus: 0.0002 }); // max 4.0302 < 4.0303
    expect(tight.reevaluated).toEqual([r.id]);
    expect(tight.opened).toHaveLength(1);
    expect(await verdictOf(r.id)).toMatchObject({ verdict: "out_of_spec" });
    expect(Number((await verdictOf(r.id)).limitMax)).toBe(4.0302);
    const audit = await getSequelize().query<{ before: unknown; after: unknown }>(
      "SELECT `before`, `after` FROM audit_events WHERE action = 'reading.re-evaluate' AND entity_id = ?",
      { replacements: [r.id], type: QueryTypes.SELECT },
    );
    const parse = (x: unknown) => (typeof x === "string" ? JSON.parse(x) : x);
    expect(parse(audit[0].before)).toMatchObject({ verdict: "in_spec", limitMax: 4.0305 });
    expect(parse(audit[0].after)).toMatchObject({ verdict: "out_of_spec", limitMax: 4.0302, cause: "limits-edit" });

    const [flag] = await flagsOf(s.job.id);
    await FlagDisposition.create({ flagId: flag.id, disposition: "measure_again", userId: s.users.lead.id });
    await Flag.update({ state: "disposed", disposition: "measure_again" }, { where: { id: flag.id } });

    const loose = await editLimit("bore_diameter", { tolPlus: 0.0005 });
    expect(loose.closed).toEqual([flag.id]);
    expect(await flagsOf(s.job.id)).toMatchObject([{ id: flag.id, state: "closed", closedByReadingId: null }]);
    expect(await count("SELECT COUNT(*) AS n FROM flag_dispositions WHERE flag_id = ?", [flag.id])).toBe(1);
    expect(
      await count("SELECT COUNT(*) AS n FROM sync_changes WHERE entity = 'flag' AND entity_id = ?", [String(flag.id)]),
    ).toBe(2); // opened, closed
  });

  it("running it again with nothing changed writes nothing", async () => {
    await push(s.users.machinist, [
      reading(s.job.id, "bore/1/top/A", 4.0312),
      reading(s.job.id, "torque/main-caps", 72),
    ]);
    const before = await count("SELECT COUNT(*) AS n FROM audit_events WHERE shop_id = ?", [s.shop.id]);
    const res = await getSequelize().transaction((t) =>
      reconcileJob(t, { shopId: s.shop.id, jobId: s.job.id, userId: null, cause: "check" }),
    );
    expect(res).toMatchObject({ opened: [], closed: [], updatedFlags: [], reevaluated: [] });
    expect(await count("SELECT COUNT(*) AS n FROM audit_events WHERE shop_id = ?", [s.shop.id])).toBe(before);
    expect(await flagsOf(s.job.id)).toHaveLength(2); // bore over 4.0305; torque 72 over 70 lbf·ft
  });

  it("a flag whose value stands but whose verdict moves is updated in place, disposition kept", async () => {
    // 4.0306 is 0.0001 over 4.0305: out of spec. Widening to 4.0306 with U = 0.0001 makes it marginal.
    const r = reading(s.job.id, "bore/2/top/A", 4.0306, { instrumentId: s.instrument.id });
    await push(s.users.machinist, [r]);
    const [flag] = await flagsOf(s.job.id);
    expect(flag).toMatchObject({ reason: "out_of_spec" });
    await Flag.update(
      { state: "disposed", disposition: "accept", dispositionReason: "Customer agreed" },
      { where: { id: flag.id } },
    );
    const res = await editLimit("bore_diameter", { tolPlus: 0.0006 });
    expect(res.updatedFlags).toEqual([flag.id]);
    const [after] = await flagsOf(s.job.id);
    expect(after).toMatchObject({ id: flag.id, state: "disposed", reason: "marginal", verdict: "marginal" });
  });

  it("derived values are re-judged too: a taper limit edit opens and closes the derived flag", async () => {
    // axis A spread 4.0303 − 4.0297 = 0.0006 in; all six readings in spec
    const batch = [
      ["top", 4.0303],
      ["mid", 4.03],
      ["bottom", 4.0297],
    ].flatMap(([d, v]) => [reading(s.job.id, `bore/3/${d}/A`, v as number), reading(s.job.id, `bore/3/${d}/B`, 4.03)]);
    await push(s.users.machinist, batch);
    expect(await flagsOf(s.job.id)).toEqual([]);
    const tight = await editLimit("bore_taper", { max: 0.0005 });
    expect(tight.opened).toHaveLength(1);
    expect(await flagsOf(s.job.id)).toMatchObject([
      { derivedKey: "bore_taper@bore/3", state: "open", verdict: "out_of_spec" },
    ]);
    const loose = await editLimit("bore_taper", { max: 0.001 });
    expect(loose.closed).toEqual(tight.opened);
  });

  it("refuses another shop's job without touching it", async () => {
    const other = await createShop();
    await expect(
      getSequelize().transaction((t) =>
        reconcileJob(t, { shopId: s.shop.id, jobId: other.job.id, userId: null, cause: "check" }),
      ),
    ).rejects.toMatchObject({ code: "not_found" });
  });
});
