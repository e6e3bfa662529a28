import "server-only";
import { UniqueConstraintError, type Transaction } from "sequelize";
import type { Attachment, Instrument } from "@/models";
import {
  calibrationStatus,
  instrumentFields,
  withInstrumentRules,
  type InstrumentFields,
  type InstrumentInput,
  type InstrumentPatch,
  type InstrumentRecord,
  type InstrumentUnit,
} from "@/lib/schemas/instrument";
import type { Actor } from "@/lib/schemas/session";
import { unitWords } from "@/lib/domain";
import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize, models } from "@/lib/server/core/db";
import { AppError, invalid, notFound } from "@/lib/server/core/errors";
import { masterProblems, type SettingMasterInput, type SettingMasterRecord } from "@/lib/schemas/setting-master";

// The shop's gauges: the feature's one door to the database, plain objects out.
// U is stored at k = 2 (coverageK stays 2: the form asks for U at k = 2).
const todayUtc = () => new Date().toISOString().slice(0, 10);

/** The setting master on file, or null (a master is on file when its size is). */
function masterOf(g: Instrument): SettingMasterRecord | null {
  if (g.masterSize === null || g.masterSize === undefined) return null;
  return { label: g.masterLabel ?? null, size: Number(g.masterSize), expandedU: Number(g.masterU ?? 0) };
}

function reshape(g: Instrument, today = todayUtc()): InstrumentRecord {
  const cert = (g as Instrument & { certificate?: Attachment | null }).certificate;
  const due = g.calibrationDue ?? today;
  return {
    id: g.id,
    kind: g.kind as InstrumentRecord["kind"],
    label: g.label,
    serial: g.serial,
    unit: g.unit as InstrumentUnit,
    resolution: g.resolution,
    expandedU: g.expandedU,
    coverageK: g.coverageK,
    rangeMin: g.rangeMin ?? null,
    rangeMax: g.rangeMax ?? null,
    calibratedOn: g.calibratedOn ?? "",
    calibrationDue: g.calibrationDue ?? "",
    dialPlusMeansSmaller: g.dialPlusMeansSmaller,
    active: g.active,
    certificate: cert ? { id: cert.id, name: cert.originalName, url: `/api/attachments/${cert.id}` } : null,
    master: masterOf(g),
    ...calibrationStatus(due, today),
  };
}

const withCertificate = () => ({ include: [{ model: models().Attachment, as: "certificate" }] });

// What the audit keeps: the figures that decide verdicts and flags.
const auditView = (g: Instrument) => ({
  kind: g.kind,
  label: g.label,
  serial: g.serial,
  unit: g.unit,
  resolution: g.resolution,
  expandedU: g.expandedU,
  coverageK: g.coverageK,
  rangeMin: g.rangeMin ?? null,
  rangeMax: g.rangeMax ?? null,
  calibratedOn: g.calibratedOn,
  calibrationDue: g.calibrationDue,
  dialPlusMeansSmaller: g.dialPlusMeansSmaller,
  active: g.active,
});

export async function listInstruments(
  shopId: number,
  opts: { includeInactive?: boolean } = {},
): Promise<InstrumentRecord[]> {
  const rows = await models().Instrument.findAll({
    where: { shopId, ...(opts.includeInactive ? {} : { active: true }) },
    order: [
      ["active", "DESC"],
      ["calibrationDue", "ASC"],
      ["label", "ASC"],
    ],
    ...withCertificate(),
  });
  const today = todayUtc();
  return rows.map((g) => reshape(g, today));
}

async function findOrThrow(shopId: number, id: number, t?: Transaction): Promise<Instrument> {
  const g = await models().Instrument.findOne({ where: { id, shopId }, transaction: t, ...withCertificate() });
  if (!g) throw notFound("Gauge");
  return g;
}

export async function getInstrument(shopId: number, id: number): Promise<InstrumentRecord> {
  return reshape(await findOrThrow(shopId, id));
}

function serialTaken(serial: string): AppError {
  return new AppError("conflict", `Serial ${serial} is already registered to another gauge in this shop`, {
    serial: ["Another gauge of this shop has this serial"],
  });
}

/** Unique (shop, serial) is enforced by the database; a race or a repeat becomes a 409 with words. */
async function guardSerial<T>(serial: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw serialTaken(serial);
    throw err;
  }
}

export async function createInstrument(actor: Actor, input: InstrumentInput): Promise<InstrumentRecord> {
  const sequelize = getSequelize();
  return guardSerial(input.serial, () =>
    sequelize.transaction(async (t) => {
      const g = await models().Instrument.create(
        { ...input, shopId: actor.shopId, coverageK: 2, active: true },
        { transaction: t },
      );
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action: "instrument.registered",
        entityType: "instrument",
        entityId: g.id,
        after: auditView(g),
      });
      return reshape(g);
    }),
  );
}

/** The stored gauge with the edit applied, checked as a whole (unit fits kind, due after calibration). */
function merged(g: Instrument, patch: InstrumentPatch): InstrumentFields {
  const { active: _a, ...fields } = patch;
  const whole = { ...auditView(g), ...fields };
  const parsed = withInstrumentRules(instrumentFields).safeParse(whole);
  if (!parsed.success) throw invalid(parsed.error);
  return parsed.data;
}

/** A master's figures are in the gauge's unit, so the unit changes only once the master is off file. */
function masterInOldUnit(unit: InstrumentUnit): AppError {
  const words =
    `Remove the setting master first (its figures are in ${unitWords(unit)}), ` +
    "then change the unit and put it on file again";
  return new AppError("invalid", words, { unit: [words] });
}

/** A new range must still hold the master on file (masterProblems' own rule), else the range fields say why. */
function masterOutsideRange(
  g: Instrument,
  next: { rangeMin: number | null; rangeMax: number | null },
): AppError | null {
  const master = masterOf(g);
  if (!master) return null;
  const unit = unitWords(g.unit as InstrumentUnit);
  const problem = masterProblems(master, {
    ...next,
    unit: g.unit as InstrumentUnit,
    resolution: Number(g.resolution),
  }).size;
  if (!problem) return null;
  const words =
    `The setting master on file (${master.label ?? "unnamed"}, ${master.size} ${unit}) would fall outside ` +
    `this range; keep ${master.size} ${unit} inside it, or change or remove the master first`;
  const field = next.rangeMax !== null && master.size > next.rangeMax ? "rangeMax" : "rangeMin"; // the end to move
  return new AppError("invalid", words, { [field]: [words] });
}

function actionFor(g: Instrument, patch: InstrumentPatch): string {
  if (patch.active === false && g.active) return "instrument.deactivated";
  if (patch.active === true && !g.active) return "instrument.reactivated";
  return "instrument.updated";
}

export async function updateInstrument(actor: Actor, id: number, patch: InstrumentPatch): Promise<InstrumentRecord> {
  const sequelize = getSequelize();
  return guardSerial(patch.serial ?? "", () =>
    sequelize.transaction(async (t) => {
      const g = await findOrThrow(actor.shopId, id, t);
      const next = merged(g, patch);
      if (next.unit !== g.unit && masterOf(g)) throw masterInOldUnit(g.unit as InstrumentUnit);
      const outside = masterOutsideRange(g, next);
      if (outside) throw outside;
      const before = auditView(g);
      const action = actionFor(g, patch);
      await g.update({ ...next, ...(patch.active !== undefined ? { active: patch.active } : {}) }, { transaction: t });
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action,
        entityType: "instrument",
        entityId: g.id,
        before,
        after: auditView(g),
      });
      return reshape(g);
    }),
  );
}

/**
 * Sets, changes (a master) or removes (null) the gauge's setting master, checked against the gauge's
 * range and step, audited with what it was before. Verdicts never read the master, so nothing is re-judged.
 */
export async function setSettingMaster(
  actor: Actor,
  id: number,
  master: SettingMasterInput | null,
): Promise<InstrumentRecord> {
  return getSequelize().transaction(async (t) => {
    const g = await findOrThrow(actor.shopId, id, t);
    if (master) {
      const gauge = {
        unit: g.unit as InstrumentUnit,
        resolution: g.resolution,
        rangeMin: g.rangeMin,
        rangeMax: g.rangeMax,
      };
      const problems = Object.entries(masterProblems(master, gauge));
      if (problems.length > 0)
        throw new AppError(
          "invalid",
          "The setting master does not fit this gauge",
          Object.fromEntries(problems.map(([field, words]) => [field, [words]])),
        );
    }
    const before = masterOf(g);
    if (!master && !before) return reshape(g); // nothing on file to remove: no change, no audit line
    const next = {
      masterLabel: master?.label ?? null,
      masterSize: master?.size ?? null,
      masterU: master?.expandedU ?? null,
    };
    await g.update(next, { transaction: t });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: master ? "instrument.master_set" : "instrument.master_removed",
      entityType: "instrument",
      entityId: g.id,
      before: { master: before },
      after: { master: masterOf(g) },
    });
    return reshape(g);
  });
}
