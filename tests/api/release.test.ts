// The release checklist and the e-signature: what blocks a release, in words with links;
// release only when nothing does; the typed name and password; the lock.
import { describe, expect, it } from "vitest";
import { GET as getView, POST as sign } from "@/app/api/release/[jobId]/route";
import { releaseChecklist } from "@/lib/server/release/checklist";
import { getSequelize } from "@/lib/server/core/db";
import { AuditEvent, Instrument, Job, Release, SyncChange } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { addFlag, completeJob, fillReadings, pastDueGauge, setPlan } from "./release-fixtures";

const url = (s: TestShop) => `/api/release/${s.job.id}`;
const params = (s: TestShop) => ({ jobId: String(s.job.id) });
const signAs = async (s: TestShop, body: unknown, who = s.users.inspector) =>
  call(sign, await asUser(who, "POST", url(s), body), params(s));
const goodSignature = (s: TestShop) => ({ fullName: s.users.inspector.name, password: TEST_PASSWORD });

describe("release checklist", () => {
  it("lists every missing required station, torque record and the plan on a fresh job", async () => {
    const s = await createShop();
    const res = await call(getView, await asUser(s.users.inspector, "GET", url(s)), params(s));
    expect(res.status).toBe(200);
    const { checklist } = res.body;
    expect(checklist.complete).toBe(false);
    const keys = checklist.unmet.map((i: { key: string }) => i.key);
    // createShop's limits: bore diameter (48 stations on a V8), main oil clearance (20 bearing
    // bores + 20 journal points), torque (5 groups), all required.
    expect(keys.filter((k: string) => k.startsWith("readings:bore/"))).toHaveLength(48);
    expect(keys.filter((k: string) => k.startsWith("readings:main-brg/"))).toHaveLength(20);
    expect(keys.filter((k: string) => k.startsWith("readings:main/"))).toHaveLength(20);
    expect(keys.filter((k: string) => k.startsWith("torque:"))).toHaveLength(5);
    expect(keys).toContain("plan:none");
    expect(keys.some((k: string) => k.startsWith("readings:skirt/"))).toBe(false); // no limit, not required
    const bore = checklist.unmet.find((i: { key: string }) => i.key === "readings:bore/3/top/A");
    expect(bore.text).toBe("Cylinder 3 · top of bore · axis A (thrust): no reading yet");
    expect(bore.links[0].href).toBe(`/bench/${s.job.id}?station=bore%2F3%2Ftop%2FA`);
    const brg = checklist.unmet.find((i: { key: string }) => i.key === "readings:main-brg/2/rear/B");
    expect(brg.text).toMatch(/needed for main bearing oil clearance/);
    const done = Object.fromEntries(checklist.checks.map((c: { id: string; ok: boolean }) => [c.id, c.ok]));
    expect(done).toEqual({ readings: false, flags: true, gauges: true, torque: false, plan: false });
  });

  it("names each kind of unmet item once the rest is complete", async () => {
    const s = await createShop();
    const old = await pastDueGauge(s);
    await fillReadings(s, {
      except: ["bore/1/top/A"],
      overrides: {
        "bore/2/mid/B": { skipped: true, skipReason: "gauge would not seat" },
        "torque/head-bolts": { lubricant: null },
        "bore/4/top/A": { instrumentId: old },
      },
    });
    await setPlan(s, { lengthUnit: "in", bore: 4.03, stroke: 3.48, pistonTop: "flat" });
    const open = await addFlag(s, "bore/5/top/A");
    const again = await addFlag(s, "bore/6/top/A", {
      state: "disposed",
      disposition: "machine_again",
      operation: "hone",
    });
    await addFlag(s, "bore/7/top/A", {
      state: "disposed",
      disposition: "accept",
      dispositionReason: "Within the piston maker's fit",
    });
    await addFlag(s, "bore/8/top/A", { state: "closed", disposition: "measure_again" });

    const list = await releaseChecklist(s.shop.id, s.job.id);
    const keys = list.unmet.map((i) => i.key).sort();
    const planGaps = ["bore", "stroke", "pistonTop"];
    const planKeys = [
      "rodLength",
      "compressionHeight",
      "chamberCc",
      "gasketBore",
      "gasketThickness",
      "deckHeight",
      "intakeLobeLift",
      "exhaustLobeLift",
      "rockerRatio",
    ];
    expect(planGaps.every((k) => !keys.includes(`plan:${k}`))).toBe(true);
    expect(keys).toEqual(
      [
        `flags:${again}`,
        `flags:${open}`,
        `gauges:${old}`,
        ...planKeys.map((k) => `plan:${k}`),
        "readings:bore/1/top/A",
        "readings:bore/2/mid/B",
        "torque:torque/head-bolts",
      ].sort(),
    );
    const text = (key: string) => list.unmet.find((i) => i.key === key)!.text;
    expect(text("readings:bore/2/mid/B")).toMatch(
      /skipped \("gauge would not seat"\); a required station must be measured/,
    );
    expect(text(`flags:${again}`)).toMatch(/machined again \(hone\).*still blocks release/);
    expect(text(`flags:${open}`)).toMatch(/open, waiting for the lead's decision/);
    expect(text(`gauges:${old}`)).toMatch(
      /past its calibration due date \(2025-01-10\) on 1 current reading: Cylinder 4/,
    );
    expect(text("torque:torque/head-bolts")).toMatch(/no lubricant recorded/);
    expect(list.unmet.find((i) => i.key === `flags:${open}`)!.links[0].href).toBe(`/desk/flags/${open}`);
    expect(list.unmet.find((i) => i.key === `gauges:${old}`)!.links[0].href).toBe("/admin/gauges");
    expect(list.unmet.find((i) => i.key === "plan:rockerRatio")!.links[0].href).toBe(`/desk/jobs/${s.job.id}/plan`);
    const flags = list.checks.find((c) => c.id === "flags")!;
    expect(flags.summary).toBe("2 flags still blocking; 1 closed, 1 accepted");
  });

  it("counts every reading's gauge: none, a kind that cannot measure the station, a range that misses", async () => {
    const s = await createShop();
    getSequelize();
    // An invented 20–50 lbf·ft wrench: the 70 lbf·ft fixture torque is past its top.
    const small = await Instrument.create({
      shopId: s.shop.id,
      kind: "torque_wrench",
      label: "Small wrench",
      serial: `SW-${s.job.code}`,
      unit: "lbf_ft",
      resolution: 1,
      expandedU: 1,
      rangeMin: 20,
      rangeMax: 50,
      calibratedOn: "2026-06-01",
      calibrationDue: "2027-06-01",
    });
    await fillReadings(s, {
      overrides: {
        "bore/1/top/A": { instrumentId: null },
        "bore/2/top/A": { instrumentId: s.gauges.mic },
        "torque/main-caps": { instrumentId: small.id },
      },
    });
    const gauges = (await releaseChecklist(s.shop.id, s.job.id)).checks.find((c) => c.id === "gauges")!;
    expect(gauges.ok).toBe(false);
    expect(gauges.summary).toBe("231 of 234 readings have a suitable gauge in calibration; 3 do not");
    const text = Object.fromEntries(gauges.items.map((i) => [i.key, i.text]));
    expect(text["gauges:none"]).toMatch(/^No gauge is recorded on 1 current reading: Cylinder 1 · top of bore/);
    expect(text[`gauges:kind:${s.gauges.mic}`]).toMatch(
      /^Kit micrometer \(serial KIT-MIC-\w+\) is an outside micrometer, which cannot measure these stations on 1/,
    );
    expect(text[`gauges:range:${small.id}`]).toMatch(
      /^Small wrench \(serial SW-[\w-]+\) reads 20–50 lbf·ft; values outside that range on 1 current reading: Torque/,
    );
  });

  it("reports complete when everything is in, and says what is complete", async () => {
    const s = await createShop();
    await completeJob(s);
    const list = await releaseChecklist(s.shop.id, s.job.id);
    expect(list.unmet).toEqual([]);
    expect(list.complete).toBe(true);
    expect(list.checks.map((c) => c.summary)).toEqual([
      "All 93 required stations have a current reading",
      "No flags on this job",
      "All 234 readings have a suitable gauge in calibration (7 gauges used)",
      "All 5 fastener groups have a torque record with the lubricant",
      "The build plan is filled in",
    ]);
  });
});

describe("signing the release", () => {
  it("refuses while the checklist has items, and says what blocks", async () => {
    const s = await createShop();
    await fillReadings(s, { except: ["torque/damper"] });
    await setPlan(s);
    const res = await signAs(s, goodSignature(s));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/cannot be released yet: 2 item/);
    expect(res.body.error.fields.checklist.join(" ")).toMatch(/Torque · crank damper bolt: no/);
    expect(await Release.count({ where: { jobId: s.job.id } })).toBe(0);
  });

  it("refuses a wrong password (403) and a name that is not the account's (422), signing nothing", async () => {
    const s = await createShop();
    await completeJob(s);
    const wrong = await signAs(s, { fullName: s.users.inspector.name, password: "not-the-password" });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.message).toBe("That password is not right, so nothing was signed");
    expect(wrong.body.error.fields.password).toEqual(["Enter the password you sign in with"]);
    const name = await signAs(s, { fullName: "Someone Else", password: TEST_PASSWORD });
    expect(name.status).toBe(422);
    expect(name.body.error.fields.fullName[0]).toContain(`"${s.users.inspector.name}" (capital letters do not matter)`);
    const empty = await signAs(s, { fullName: "  ", password: "" });
    expect(empty.status).toBe(422);
    expect(Object.keys(empty.body.error.fields).sort()).toEqual(["fullName", "password"]);
    expect(await Release.count({ where: { jobId: s.job.id } })).toBe(0);
    expect((await Job.findByPk(s.job.id))!.status).toBe("measuring");
  });

  it("locks the signer out for a while after five wrong passwords", async () => {
    const s = await createShop();
    await completeJob(s);
    for (let i = 0; i < 5; i++)
      expect((await signAs(s, { fullName: s.users.inspector.name, password: `wrong-${i}` })).status).toBe(403);
    const locked = await signAs(s, goodSignature(s));
    expect(locked.status).toBe(429);
    expect(locked.body.error.message).toMatch(/Too many wrong passwords. Try again in 15 min/);
  });

  it("releases a complete job: stores the hash, locks the job, audits and feeds the change", async () => {
    const s = await createShop();
    await completeJob(s);
    const res = await signAs(s, { fullName: `  ${s.users.inspector.name.toUpperCase()} `, password: TEST_PASSWORD });
    expect(res.status).toBe(201);
    const { release } = res.body;
    expect(release.status).toBe("standing");
    expect(release.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(release.inspectorName).toBe(s.users.inspector.name); // the registered name, not as typed
    const job = await Job.findByPk(s.job.id);
    expect(job!.status).toBe("released");
    expect(job!.lockedAt!.toISOString()).toBe(release.signedAt);
    const audit = await AuditEvent.findOne({ where: { shopId: s.shop.id, action: "release.sign" } });
    expect(audit!.entityId).toBe(String(release.id));
    expect((audit!.after as Record<string, unknown>).hash).toBe(release.hash);
    expect((audit!.after as Record<string, unknown>).typedSignature).toBe(s.users.inspector.name.toUpperCase());
    expect(await SyncChange.count({ where: { jobId: s.job.id, entity: "job" } })).toBe(1);
    const again = await signAs(s, goodSignature(s));
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already released\. Only a lead can reopen it/);
  });
});

describe("who may do what", () => {
  const cases = [
    { role: "inspector", view: 200, sign: 201 },
    { role: "lead", view: 200, sign: 403 },
    { role: "machinist", view: 403, sign: 403 },
    { role: "admin", view: 403, sign: 403 },
  ] as const;
  it.each(cases)("$role: view $view, sign $sign", async ({ role, view, sign: expected }) => {
    const s = await createShop();
    await completeJob(s);
    expect((await call(getView, await asUser(s.users[role], "GET", url(s)), params(s))).status).toBe(view);
    expect((await signAs(s, { fullName: s.users[role].name, password: TEST_PASSWORD }, s.users[role])).status).toBe(
      expected,
    );
  });

  it("401 signed out; 404 for another shop's job, as for one that does not exist", async () => {
    const a = await createShop();
    const b = await createShop();
    await completeJob(b);
    expect((await call(getView, await asUser(null, "GET", url(a)), params(a))).status).toBe(401);
    const view = await call(getView, await asUser(a.users.inspector, "GET", url(b)), params(b));
    const missing = await call(getView, await asUser(a.users.inspector, "GET", "/api/release/99999999"), {
      jobId: "99999999",
    });
    expect(view.status).toBe(404);
    expect(view.body).toEqual(missing.body);
    const signed = await call(
      sign,
      await asUser(a.users.inspector, "POST", url(b), { fullName: a.users.inspector.name, password: TEST_PASSWORD }),
      params(b),
    );
    expect(signed.status).toBe(404);
    expect(await Release.count({ where: { jobId: b.job.id } })).toBe(0);
  });
});
