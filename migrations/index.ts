// Every migration, in order, as a static import map: a bundler cannot lose a file, and the order
// is the array's, not the file system's. Add a new migration at the end; never edit a shipped one.
import type { QueryInterface } from "sequelize";
import * as createShopsAndUsers from "./20261201000100-create-shops-and-users";
import * as createCustomersAndEngines from "./20261201000200-create-customers-and-engines";
import * as createAttachments from "./20261201000300-create-attachments";
import * as createSpecTemplatesAndLimits from "./20261201000400-create-spec-templates-and-limits";
import * as createJobsAndJobLimits from "./20261201000500-create-jobs-and-job-limits";
import * as createInstruments from "./20261201000600-create-instruments";
import * as createReadings from "./20261201000700-create-readings";
import * as createFlagsAndDispositions from "./20261201000800-create-flags-and-dispositions";
import * as createReleases from "./20261201000900-create-releases";
import * as createAuditEvents from "./20261201001000-create-audit-events";
import * as createSyncChanges from "./20261201001100-create-sync-changes";
import * as createMailOutbox from "./20261201001200-create-mail-outbox";
import * as addReadingsGaugeTemp from "./20261202000100-add-readings-gauge-temp";
import * as addJobsContextRevision from "./20261202000200-add-jobs-context-revision";
import * as addJobsFinishedSizes from "./20261203010000-add-jobs-finished-sizes";
import * as addInstrumentsRange from "./20261203030000-add-instruments-range";
import * as createUserSessions from "./20261203050000-create-user-sessions";
import * as addAttachmentsClientId from "./20261203130000-add-attachments-client-id";
import * as addLimitsCommonPractice from "./20261203140000-add-limits-common-practice";
import * as addShopsActivatedAt from "./20261203140010-add-shops-activated-at";
import * as createLinkTokens from "./20261203150000-create-link-tokens";
import * as addUsersMustChangePassword from "./20261203150100-add-users-must-change-password";
import * as addReadingsArchiveIndex from "./20261203170000-add-readings-archive-index";
import * as addSyncChangesSeq from "./20261204020000-add-sync-changes-seq";
import * as createJobProgress from "./20261204050000-create-job-progress";
import * as addReleasesRecordFile from "./20261204060000-add-releases-record-file";
import * as createBearingTables from "./20261204080000-create-bearing-tables";
import * as addFlagsQueueKeys from "./20261205010000-add-flags-queue-keys";
import * as addAuditEventsJob from "./20261205011000-add-audit-events-job";
import * as addReadingsJobSupersedesIndex from "./20261205020000-add-readings-job-supersedes-index";
import * as createGaugeStudies from "./20261205030000-create-gauge-studies";
import * as addFlagsStudyReasons from "./20261205031000-add-flags-study-reasons";
import * as addSyncChangesShopSeq from "./20261205040000-add-sync-changes-shop-seq";

type Step = (p: { context: QueryInterface }) => Promise<void>;
export type Migration = { name: string; up: Step; down: Step };

function step(name: string, m: { up: Step; down: Step }): Migration {
  return { name, up: m.up, down: m.down };
}

export const migrations: Migration[] = [
  step("20261201000100-create-shops-and-users", createShopsAndUsers),
  step("20261201000200-create-customers-and-engines", createCustomersAndEngines),
  step("20261201000300-create-attachments", createAttachments),
  step("20261201000400-create-spec-templates-and-limits", createSpecTemplatesAndLimits),
  step("20261201000500-create-jobs-and-job-limits", createJobsAndJobLimits),
  step("20261201000600-create-instruments", createInstruments),
  step("20261201000700-create-readings", createReadings),
  step("20261201000800-create-flags-and-dispositions", createFlagsAndDispositions),
  step("20261201000900-create-releases", createReleases),
  step("20261201001000-create-audit-events", createAuditEvents),
  step("20261201001100-create-sync-changes", createSyncChanges),
  step("20261201001200-create-mail-outbox", createMailOutbox),
  step("20261202000100-add-readings-gauge-temp", addReadingsGaugeTemp),
  step("20261202000200-add-jobs-context-revision", addJobsContextRevision),
  step("20261203010000-add-jobs-finished-sizes", addJobsFinishedSizes),
  step("20261203030000-add-instruments-range", addInstrumentsRange),
  step("20261203050000-create-user-sessions", createUserSessions),
  step("20261203130000-add-attachments-client-id", addAttachmentsClientId),
  step("20261203140000-add-limits-common-practice", addLimitsCommonPractice),
  step("20261203140010-add-shops-activated-at", addShopsActivatedAt),
  step("20261203150000-create-link-tokens", createLinkTokens),
  step("20261203150100-add-users-must-change-password", addUsersMustChangePassword),
  step("20261203170000-add-readings-archive-index", addReadingsArchiveIndex),
  step("20261204020000-add-sync-changes-seq", addSyncChangesSeq),
  step("20261204050000-create-job-progress", createJobProgress),
  step("20261204060000-add-releases-record-file", addReleasesRecordFile),
  step("20261204080000-create-bearing-tables", createBearingTables),
  step("20261205010000-add-flags-queue-keys", addFlagsQueueKeys),
  step("20261205011000-add-audit-events-job", addAuditEventsJob),
  step("20261205020000-add-readings-job-supersedes-index", addReadingsJobSupersedesIndex),
  step("20261205030000-create-gauge-studies", createGaugeStudies),
  step("20261205031000-add-flags-study-reasons", addFlagsStudyReasons),
  step("20261205040000-add-sync-changes-shop-seq", addSyncChangesShopSeq),
];

/** Every table the migrations create, for tests and tooling that check the schema. */
export const MIGRATED_TABLES = [
  "shops",
  "users",
  "auth_throttle",
  "customers",
  "engines",
  "attachments",
  "spec_templates",
  "spec_limits",
  "jobs",
  "job_limits",
  "instruments",
  "readings",
  "flags",
  "flag_dispositions",
  "releases",
  "audit_events",
  "sync_changes",
  "sync_sequences",
  "mail_outbox",
  "user_sessions",
  "link_tokens",
  "job_progress",
  "bearing_shells",
  "bearing_points",
  "bearing_grade_tables",
  "gauge_studies",
] as const;
