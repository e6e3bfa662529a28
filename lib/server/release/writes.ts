import "server-only";
import type { Transaction } from "sequelize";
import type { JsonValue } from "@/lib/schemas/json";
import { AuthThrottle, Job, Release, User } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { AppError, notFound } from "@/lib/server/core/errors";
import type { ReleaseRow } from "@/lib/server/release/repo";

// Writes of the release: the release row, the job's lock, voiding, and the re-typed password's
// throttle (kept in auth_throttle like sign-in's, so every app instance sees the same count).

const WINDOW_MINUTES = 15;
const LOCK_AFTER = 5;
const LOCK_MINUTES = 15;

export async function signerAccount(
  userId: number,
  shopId: number,
): Promise<{ name: string; passwordHash: string } | null> {
  getSequelize();
  const u = await User.findOne({ where: { id: userId, shopId, active: true }, attributes: ["name", "passwordHash"] });
  return u ? { name: u.name, passwordHash: u.passwordHash } : null;
}

/** 429 while this key is locked out after repeated wrong passwords. */
export async function refuseIfThrottled(key: string): Promise<void> {
  getSequelize();
  const row = await AuthThrottle.findByPk(key);
  const until = row?.lockedUntil?.getTime() ?? 0;
  if (until > Date.now()) {
    const minutes = Math.max(1, Math.ceil((until - Date.now()) / 60_000));
    throw new AppError(
      "too_many_attempts",
      `Too many wrong passwords. Try again in ${minutes} min, or sign out and in again.`,
      undefined,
      {
        "Retry-After": String(minutes * 60),
      },
    );
  }
}

/** Counts a wrong password outside any transaction, so a rollback cannot undo the count. */
export async function recordWrongPassword(key: string): Promise<number> {
  getSequelize();
  const now = new Date();
  const [row] = await AuthThrottle.findOrCreate({
    where: { throttleKey: key },
    defaults: { throttleKey: key, failures: 0, windowStartedAt: now, lockedUntil: null },
  });
  const fresh = now.getTime() - row.windowStartedAt.getTime() > WINDOW_MINUTES * 60_000;
  const failures = fresh ? 1 : row.failures + 1;
  const lockedUntil = failures >= LOCK_AFTER ? new Date(now.getTime() + LOCK_MINUTES * 60_000) : row.lockedUntil;
  await row.update({ failures, windowStartedAt: fresh ? now : row.windowStartedAt, lockedUntil });
  return failures;
}

export async function clearWrongPasswords(key: string): Promise<void> {
  getSequelize();
  await AuthThrottle.destroy({ where: { throttleKey: key } });
}

/** The job row, locked FOR UPDATE inside `t`; 404 for another shop's job. */
export async function lockJob(t: Transaction, shopId: number, jobId: number) {
  const job = await Job.findOne({ where: { id: jobId, shopId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!job) throw notFound("Job");
  return { id: job.id, code: job.code, status: job.status, lockedAt: job.lockedAt };
}

export type NewRelease = {
  shopId: number;
  jobId: number;
  inspectorId: number;
  signedName: string;
  signedAt: Date;
  checklist: JsonValue;
  hash: string;
  canonicalVersion: number;
};

export async function insertRelease(t: Transaction, r: NewRelease): Promise<ReleaseRow> {
  const row = await Release.create(r, { transaction: t });
  return row.get({ plain: true }) as ReleaseRow;
}

export async function setJobReleased(t: Transaction, jobId: number, at: Date): Promise<void> {
  await Job.update({ status: "released", lockedAt: at }, { where: { id: jobId }, transaction: t });
}

export async function setJobReopened(t: Transaction, jobId: number): Promise<void> {
  await Job.update({ status: "review", lockedAt: null }, { where: { id: jobId }, transaction: t });
}

export async function voidRelease(t: Transaction, id: number, userId: number, reason: string, at: Date): Promise<void> {
  await Release.update(
    { voidedAt: at, voidedBy: userId, voidReason: reason },
    { where: { id, voidedAt: null }, transaction: t },
  );
}
