// Reopening voids a release (visibly, with the reason) and verification recomputes the hash from
// the database: a row changed with raw SQL after release is detected, in words.
import { QueryTypes } from "sequelize";
import { describe, expect, it } from "vitest";
import { GET as getView, POST as sign } from "@/app/api/release/[jobId]/route";
import { POST as reopen } from "@/app/api/release/[jobId]/reopen/route";
import { GET as verify } from "@/app/api/release/[jobId]/verify/route";
import { GET as publicVerify } from "@/app/api/release/verify/route";
import { getSequelize } from "@/lib/server/core/db";
import { AuditEvent, Job } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";
import { asOwner } from "../support/owner-db";

const params = (s: TestShop) => ({ jobId: String(s.job.id) });
const base = (s: TestShop) => `/api/release/${s.job.id}`;

async function released(s: TestShop) {
  const readings = await completeJob(s);
  const res = await call(
    sign,
    await asUser(s.users.inspector, "POST", base(s), { fullName: s.users.inspector.name, password: TEST_PASSWORD }),
    params(s),
  );
  expect(res.status).toBe(201);
  return { readings, release: res.body.release as { id: number; hash: string; signedAt: string } };
}

const check = async (s: TestShop, who = s.users.inspector) =>
  call(verify, await asUser(who, "GET", `${base(s)}/verify`), params(s));
const checkPublic = async (query: string) =>
  call(publicVerify, await asUser(null, "GET", `/api/release/verify?${query}`));

describe("reopen", () => {
  it("needs a reason, voids the release visibly, unlocks the job and needs a new release", async () => {
    const s = await createShop();
    const { release } = await released(s);
    const noReason = await call(
      reopen,
      await asUser(s.users.lead, "POST", `${base(s)}/reopen`, { reason: " " }),
      params(s),
    );
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields.reason[0]).toMatch(/Say why the job is reopened/);

    const reason = "Customer asked for a thicker head gasket; deck clearance must be re-checked";
    const res = await call(reopen, await asUser(s.users.lead, "POST", `${base(s)}/reopen`, { reason }), params(s));
    expect(res.status).toBe(200);
    expect(res.body.release).toMatchObject({
      id: release.id,
      status: "void",
      voidReason: reason,
      voidedByName: s.users.lead.name,
    });
    const job = await Job.findByPk(s.job.id);
    expect(job!.status).toBe("review");
    expect(job!.lockedAt).toBeNull();

    const view = await call(getView, await asUser(s.users.inspector, "GET", base(s)), params(s));
    expect(view.body.releases[0]).toMatchObject({ id: release.id, status: "void", voidReason: reason });
    expect(view.body.can).toEqual({ sign: true, reopen: false });
    const v = await check(s);
    expect(v.body.status).toBe("void");
    expect(v.body.words).toMatch(
      new RegExp(`^VOID: this release was voided on .* by ${s.users.lead.name}\\. Reason: Customer asked`),
    );
    const pub = await checkPublic(`hash=${release.hash}`);
    expect(pub.body).toMatchObject({ status: "void", jobCode: s.job.code });
    expect(JSON.stringify(pub.body)).not.toContain("gasket"); // the reason stays inside the shop

    const audit = await AuditEvent.findOne({
      where: { shopId: s.shop.id, action: "release.void", entityId: String(release.id) },
    });
    expect((audit!.after as Record<string, unknown>).voidReason).toBe(reason);

    const again = await call(reopen, await asUser(s.users.lead, "POST", `${base(s)}/reopen`, { reason }), params(s));
    expect(again.status).toBe(409);
    const second = await call(
      sign,
      await asUser(s.users.inspector, "POST", base(s), { fullName: s.users.inspector.name, password: TEST_PASSWORD }),
      params(s),
    );
    expect(second.status).toBe(201);
    expect(second.body.release.id).not.toBe(release.id);
    expect(second.body.release.hash).not.toBe(release.hash); // a new signature time, so a new fingerprint
  });

  it.each([
    { role: "lead", status: 200 },
    { role: "inspector", status: 403 },
    { role: "machinist", status: 403 },
    { role: "admin", status: 403 },
  ] as const)("$role reopening gets $status", async ({ role, status }) => {
    const s = await createShop();
    await released(s);
    const res = await call(
      reopen,
      await asUser(s.users[role], "POST", `${base(s)}/reopen`, {
        reason: "Re-check the main caps, torque wrench was dropped",
      }),
      params(s),
    );
    expect(res.status).toBe(status);
    expect((await Job.findByPk(s.job.id))!.status).toBe(status === 200 ? "review" : "released");
  });

  it("404 for another shop's job", async () => {
    const a = await createShop();
    const b = await createShop();
    await released(b);
    const res = await call(
      reopen,
      await asUser(a.users.lead, "POST", `/api/release/${b.job.id}/reopen`, { reason: "Not ours to reopen at all" }),
      params(b),
    );
    expect(res.status).toBe(404);
    expect((await check(b, a.users.inspector)).status).toBe(404);
    expect((await Job.findByPk(b.job.id))!.status).toBe("released");
  });
});

describe("verification", () => {
  it("matches right after release, detects a value changed in the database, and matches again when restored", async () => {
    const s = await createShop();
    const { readings, release } = await released(s);
    const first = await check(s);
    expect(first.status).toBe(200);
    expect(first.body.status).toBe("match");
    expect(first.body.recomputedHash).toBe(release.hash);
    expect((await checkPublic(`hash=${release.hash}&job=${s.job.code}`)).body.status).toBe("match");

    const target = readings.find((r) => r.stationId === "bore/4/mid/B")!;
    const db = getSequelize();
    const [{ v }] = await db.query<{ v: string }>(
      "SELECT CAST(value_canonical AS CHAR) AS v FROM readings WHERE id = ?",
      { type: QueryTypes.SELECT, replacements: [target.id] },
    );
    // Behind the app's back, as the owner: the app's own account may not change a reading's figures.
    await asOwner("UPDATE readings SET value_canonical = value_canonical + 0.000001 WHERE id = ?", [target.id]);
    const changed = await check(s);
    expect(changed.body.status).toBe("changed");
    expect(changed.body.words).toMatch(
      /^Changed since release: .* 1 record\(s\) differ: Reading at Cylinder 4 · middle of bore · axis B \(pin\) \(changed\)/,
    );
    expect(changed.body.differences).toEqual([
      {
        section: "readings",
        id: target.id,
        label: "Reading at Cylinder 4 · middle of bore · axis B (pin)",
        change: "changed",
      },
    ]);
    const pub = await checkPublic(`hash=${release.hash}`);
    expect(pub.body.status).toBe("changed");
    expect(Object.keys(pub.body).sort()).toEqual(["jobCode", "signedAt", "status", "voidedAt", "words"]);

    await asOwner("UPDATE readings SET value_canonical = ? WHERE id = ?", [v, target.id]);
    expect((await check(s)).body.status).toBe("match");
  });

  it("detects a reading added and a limit changed behind the app", async () => {
    const s = await createShop();
    const { release } = await released(s);
    const db = getSequelize();
    await asOwner("UPDATE job_limits SET max = max + 0.0001 WHERE job_id = ? AND characteristic = 'bore_taper'", [
      s.job.id,
    ]);
    await db.query(
      `INSERT INTO readings (id, shop_id, job_id, station_id, characteristic, value_canonical, unit_entered,
         taken_by, taken_at, received_at, device_id, created_at, updated_at)
       VALUES (UUID(), ?, ?, 'skirt/1', 'piston_skirt_diameter', 102.3, 'in', ?,
         NOW(3), NOW(3), 'sql', NOW(3), NOW(3))`,
      { replacements: [s.shop.id, s.job.id, s.users.machinist.id] },
    );
    const res = await check(s);
    expect(res.body.status).toBe("changed");
    expect(
      res.body.differences.map((d: { section: string; change: string }) => `${d.section}:${d.change}`).sort(),
    ).toEqual(["limits:changed", "readings:added"]);
    expect((await checkPublic(`hash=${release.hash}`)).body.status).toBe("changed");
  });

  it("public checks need the full fingerprint and reveal nothing for a wrong one", async () => {
    const s = await createShop();
    const { release } = await released(s);
    const short = await checkPublic(`hash=${release.hash.slice(0, 20)}`);
    expect(short.status).toBe(422);
    expect(short.body.error.fields.hash[0]).toMatch(/64 characters/);
    const unknown = await checkPublic(`hash=${"0".repeat(64)}`);
    expect(unknown.status).toBe(404);
    const wrongJob = await checkPublic(`hash=${release.hash}&job=NOT-${s.job.code}`);
    expect(wrongJob.status).toBe(404);
    expect(wrongJob.body).toEqual(unknown.body);
    const upper = await checkPublic(`hash=${release.hash.toUpperCase()}`);
    expect(upper.body).toMatchObject({ status: "match", jobCode: s.job.code, signedAt: release.signedAt });
  });

  it.each([
    { role: "inspector", status: 200 },
    { role: "lead", status: 200 },
    { role: "admin", status: 200 },
    { role: "machinist", status: 403 },
  ] as const)("$role verifying gets $status", async ({ role, status }) => {
    const s = await createShop();
    await released(s);
    expect((await check(s, s.users[role])).status).toBe(status);
  });

  it("says there is nothing to verify before the first release", async () => {
    const s = await createShop();
    const res = await check(s);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe("This job has not been released yet, so there is nothing to verify");
  });
});
