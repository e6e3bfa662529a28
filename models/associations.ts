// Associations between the models, for `include` in repos. Foreign keys, ON DELETE rules and
// indexes live in the migrations; `constraints: false` here only tells Sequelize not to try
// to manage them itself (the schema never comes from sync()).
import type { Model, ModelStatic } from "sequelize";
import { Attachment } from "./attachment";
import { AuditEvent } from "./audit-event";
import { Customer } from "./customer";
import { Engine } from "./engine";
import { Flag } from "./flag";
import { FlagDisposition } from "./flag-disposition";
import { GaugeStudy } from "./gauge-study";
import { Instrument } from "./instrument";
import { Job } from "./job";
import { JobLimit } from "./job-limit";
import { MailOutbox } from "./mail-outbox";
import { Reading } from "./reading";
import { Release } from "./release";
import { Shop } from "./shop";
import { SpecLimit } from "./spec-limit";
import { SpecTemplate } from "./spec-template";
import { SyncChange } from "./sync-change";
import { User } from "./user";

const off = { constraints: false } as const;

function associateShop(): void {
  const children: ModelStatic<Model>[] = [
    User,
    Customer,
    Engine,
    SpecTemplate,
    Job,
    Instrument,
    Attachment,
    AuditEvent,
    Reading,
    Flag,
    Release,
    SyncChange,
    MailOutbox,
  ];
  for (const child of children) child.belongsTo(Shop, { ...off, as: "shop", foreignKey: "shopId" });
  Shop.hasMany(User, { ...off, as: "users", foreignKey: "shopId" });
}

function associateJobs(): void {
  Customer.hasMany(Engine, { ...off, as: "engines", foreignKey: "customerId" });
  Engine.belongsTo(Customer, { ...off, as: "customer", foreignKey: "customerId" });
  Customer.hasMany(Job, { ...off, as: "jobs", foreignKey: "customerId" });
  Job.belongsTo(Customer, { ...off, as: "customer", foreignKey: "customerId" });
  Engine.hasMany(Job, { ...off, as: "jobs", foreignKey: "engineId" });
  Job.belongsTo(Engine, { ...off, as: "engine", foreignKey: "engineId" });
  SpecTemplate.hasMany(SpecLimit, { ...off, as: "limits", foreignKey: "templateId" });
  SpecLimit.belongsTo(SpecTemplate, { ...off, as: "template", foreignKey: "templateId" });
  Job.belongsTo(SpecTemplate, { ...off, as: "template", foreignKey: "templateId" });
  Job.hasMany(JobLimit, { ...off, as: "limits", foreignKey: "jobId" });
  JobLimit.belongsTo(Job, { ...off, as: "job", foreignKey: "jobId" });
  Job.hasMany(Release, { ...off, as: "releases", foreignKey: "jobId" });
  Release.belongsTo(Job, { ...off, as: "job", foreignKey: "jobId" });
  Release.belongsTo(User, { ...off, as: "inspector", foreignKey: "inspectorId" });
  Release.belongsTo(User, { ...off, as: "voider", foreignKey: "voidedBy" });
  SyncChange.belongsTo(Job, { ...off, as: "job", foreignKey: "jobId" });
}

function associateReadings(): void {
  Job.hasMany(Reading, { ...off, as: "readings", foreignKey: "jobId" });
  Reading.belongsTo(Job, { ...off, as: "job", foreignKey: "jobId" });
  Reading.belongsTo(Instrument, { ...off, as: "instrument", foreignKey: "instrumentId" });
  Reading.belongsTo(User, { ...off, as: "taker", foreignKey: "takenBy" });
  Reading.belongsTo(Reading, { ...off, as: "supersededReading", foreignKey: "supersedes" });
  Reading.hasMany(Reading, { ...off, as: "corrections", foreignKey: "supersedes" });
  Instrument.belongsTo(Attachment, { ...off, as: "certificate", foreignKey: "certificateAttachmentId" });
  Attachment.belongsTo(User, { ...off, as: "uploader", foreignKey: "uploadedBy" });
  GaugeStudy.belongsTo(Instrument, { ...off, as: "instrument", foreignKey: "instrumentId" });
  GaugeStudy.belongsTo(User, { ...off, as: "performer", foreignKey: "performedBy" });
}

function associateFlags(): void {
  Job.hasMany(Flag, { ...off, as: "flags", foreignKey: "jobId" });
  Flag.belongsTo(Job, { ...off, as: "job", foreignKey: "jobId" });
  Flag.belongsTo(Reading, { ...off, as: "reading", foreignKey: "readingId" });
  Reading.hasMany(Flag, { ...off, as: "flags", foreignKey: "readingId" });
  Flag.belongsTo(Reading, { ...off, as: "closingReading", foreignKey: "closedByReadingId" });
  Flag.belongsTo(User, { ...off, as: "disposer", foreignKey: "disposedBy" });
  Flag.hasMany(FlagDisposition, { ...off, as: "dispositions", foreignKey: "flagId" });
  FlagDisposition.belongsTo(Flag, { ...off, as: "flag", foreignKey: "flagId" });
  FlagDisposition.belongsTo(User, { ...off, as: "user", foreignKey: "userId" });
  AuditEvent.belongsTo(User, { ...off, as: "user", foreignKey: "userId" });
}

export function associate(): void {
  associateShop();
  associateJobs();
  associateReadings();
  associateFlags();
}
