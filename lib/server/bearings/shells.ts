import "server-only";
import type { Transaction } from "sequelize";
import { implausibleWalls, type ShellInput } from "@/lib/schemas/bearings";
import type { Actor } from "@/lib/schemas/session";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { lockJobOrThrow } from "@/lib/server/jobs/repo";
import { recordAudit } from "@/lib/server/log/repo";
import { findInstruments } from "@/lib/server/readings/gauge-repo";
import {
  deleteShell,
  getShellOrThrow,
  insertShell,
  pointsUsingShell,
  updateShell,
  type ShellFields,
} from "@/lib/server/bearings/repo";

// The shells on a job's shelf: entered, corrected and taken off by the lead. Figures are in the
// job's unit; only the fields the wall's source uses are kept, so a switch of source leaves no
// stale figure behind.

function fieldsOf(input: ShellInput, unit: "in" | "mm"): ShellFields {
  const src = input.wallSource ?? null;
  return {
    series: input.series,
    role: input.role,
    step: input.step,
    stepAmount: input.step === "standard" || input.step === "graded" ? null : (input.stepAmount ?? null),
    grade: input.step === "graded" ? (input.grade ?? null) : null,
    wallSource: src,
    wall: src === "nominal" ? (input.wall ?? null) : null,
    wallMin: src === "range" ? (input.wallMin ?? null) : null,
    wallMax: src === "range" ? (input.wallMax ?? null) : null,
    wallUpper: src === "measured" ? (input.wallUpper ?? null) : null,
    wallLower: src === "measured" ? (input.wallLower ?? null) : null,
    wallGaugeId: src === "measured" ? (input.wallGaugeId ?? null) : null,
    halvesUpper: input.halvesUpper,
    halvesLower: input.halvesLower,
    unit,
  };
}

async function checkGauge(t: Transaction, shopId: number, gaugeId: number | null | undefined): Promise<void> {
  if (!gaugeId) return;
  const found = await findInstruments(t, shopId, [gaugeId]);
  if (!found.has(gaugeId)) {
    throw new AppError("invalid", "Some fields need fixing", { wallGaugeId: ["Pick one of this shop's gauges"] });
  }
}

async function editableJob(t: Transaction, actor: Actor, jobId: number) {
  const job = await lockJobOrThrow(t, actor.shopId, jobId);
  assertJobEditable(job);
  return job;
}

function checkWalls(input: ShellInput, unit: "in" | "mm") {
  const fields = implausibleWalls(input, unit);
  if (Object.keys(fields).length) throw new AppError("invalid", "Some fields need fixing", fields);
}

export async function addShell(actor: Actor, jobId: number, input: ShellInput): Promise<number> {
  return getSequelize().transaction(async (t) => {
    const job = await editableJob(t, actor, jobId);
    checkWalls(input, job.unitSystem);
    await checkGauge(t, actor.shopId, input.wallGaugeId);
    const row = await insertShell(t, actor.shopId, jobId, fieldsOf(input, job.unitSystem));
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.shell_add",
      entityType: "job",
      entityId: jobId,
      after: { shellId: row.id, ...fieldsOf(input, job.unitSystem) },
    });
    return row.id;
  });
}

export async function editShell(actor: Actor, jobId: number, shellId: number, input: ShellInput): Promise<void> {
  await getSequelize().transaction(async (t) => {
    const job = await editableJob(t, actor, jobId);
    const before = await getShellOrThrow(t, actor.shopId, jobId, shellId);
    checkWalls(input, job.unitSystem);
    await checkGauge(t, actor.shopId, input.wallGaugeId);
    const fields = fieldsOf(input, job.unitSystem);
    await updateShell(t, shellId, fields);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.shell_edit",
      entityType: "job",
      entityId: jobId,
      before,
      after: { shellId, ...fields },
    });
  });
}

export async function removeShell(actor: Actor, jobId: number, shellId: number): Promise<void> {
  await getSequelize().transaction(async (t) => {
    await editableJob(t, actor, jobId);
    const before = await getShellOrThrow(t, actor.shopId, jobId, shellId);
    const users = await pointsUsingShell(t, jobId, shellId);
    if (users.length) {
      throw new AppError(
        "conflict",
        `The saved choice uses this set at ${users.join(", ")}; choose other halves there first, then remove it`,
      );
    }
    await deleteShell(t, shellId);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.shell_remove",
      entityType: "job",
      entityId: jobId,
      before,
    });
  });
}
