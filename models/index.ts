// The Sequelize models of Tenthwise. lib/server/core/db.ts calls initModels(sequelize) once on its
// instance; in lib/server only each feature's repo.ts imports from here, and repos return plain
// objects. The value sets of the ENUM columns live in lib/domain/enums.ts and lib/schemas/enums.ts.
//
// Conventions every model follows:
// - camelCase attributes over snake_case columns (`underscored: true`); tables are snake_case plural.
// - The schema comes only from migrations/ (umzug). Never call sync().
// - DECIMAL columns: depending on driver options the mariadb connector returns them as strings
//   (exact digits) or numbers; with Sequelize's own defaults (supportBigNumbers) mariadb 3.5 gives
//   numbers. Each DECIMAL attribute has a getter returning `number` (or `null` for a nullable
//   column) whatever the options, so instance.get(), get({ plain: true }) and toJSON() all give
//   numbers. Queries with `raw: true` and sequelize.query() skip getters and return what the
//   driver returns; pass such values through decimalToNumber().
// - BIGINT ids (AuditEvent.id, SyncChange.id) have a getter returning `number` for the same
//   reason (the driver may return BigInt, which JSON.stringify refuses).
// - DATEONLY attributes are 'YYYY-MM-DD' strings; DATETIME(3) attributes are Dates.
import type { Sequelize } from "sequelize";
import { associate } from "./associations";
import { Attachment, initAttachment } from "./attachment";
import { AuditEvent, initAuditEvent } from "./audit-event";
import { AuthThrottle, initAuthThrottle } from "./auth-throttle";
import { BearingGradeTable, initBearingGradeTable } from "./bearing-grade-table";
import { BearingPoint, initBearingPoint } from "./bearing-point";
import { BearingShell, initBearingShell } from "./bearing-shell";
import { Customer, initCustomer } from "./customer";
import { Engine, initEngine } from "./engine";
import { Flag, initFlag } from "./flag";
import { GaugeStudy, initGaugeStudy } from "./gauge-study";
import { FlagDisposition, initFlagDisposition } from "./flag-disposition";
import { Instrument, initInstrument } from "./instrument";
import { Job, initJob } from "./job";
import { JobLimit, initJobLimit } from "./job-limit";
import { LinkToken, initLinkToken } from "./link-token";
import { MailOutbox, initMailOutbox } from "./mail-outbox";
import { Reading, initReading } from "./reading";
import { Release, initRelease } from "./release";
import { Shop, initShop } from "./shop";
import { SpecLimit, initSpecLimit } from "./spec-limit";
import { SpecTemplate, initSpecTemplate } from "./spec-template";
import { SyncChange, initSyncChange } from "./sync-change";
import { User, initUser } from "./user";
import { UserSession, initUserSession } from "./user-session";

export {
  Attachment,
  AuditEvent,
  AuthThrottle,
  BearingGradeTable,
  BearingPoint,
  BearingShell,
  Customer,
  Engine,
  Flag,
  FlagDisposition,
  GaugeStudy,
  Instrument,
  Job,
  JobLimit,
  LinkToken,
  MailOutbox,
  Reading,
  Release,
  Shop,
  SpecLimit,
  SpecTemplate,
  SyncChange,
  User,
  UserSession,
};
export { decimalToNumber } from "./columns";

const INITIALISERS = [
  initShop,
  initUser,
  initAuthThrottle,
  initCustomer,
  initEngine,
  initAttachment,
  initSpecTemplate,
  initSpecLimit,
  initJob,
  initJobLimit,
  initInstrument,
  initReading,
  initFlag,
  initFlagDisposition,
  initRelease,
  initAuditEvent,
  initSyncChange,
  initMailOutbox,
  initUserSession,
  initLinkToken,
  initBearingShell,
  initBearingPoint,
  initBearingGradeTable,
  initGaugeStudy,
];

let boundTo: Sequelize | null = null;

/**
 * Binds every model to `sequelize` and defines the associations. Calling it again with the same
 * instance does nothing; with another instance it rebinds (Model.init clears the associations,
 * so they are defined afresh).
 */
export function initModels(sequelize: Sequelize): void {
  if (boundTo === sequelize) return;
  boundTo = null;
  for (const init of INITIALISERS) init(sequelize);
  associate();
  boundTo = sequelize;
}
