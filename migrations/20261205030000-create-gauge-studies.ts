// Gauge capability studies (issue 17): a repeatability ("type 1") study of a gauge on a reference,
// or an R&R study across appraisers and parts, kept with its raw figures, the summary the verdict
// uses (repeatability s, bias) and the core's whole result. The shop's pass thresholds live on
// shops (defaults: common practice), and a gauge may name the setting master a study measures.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  bool,
  createdAt,
  decimal,
  enumOf,
  fk,
  intId,
  varchar,
  type MigrationParams,
} from "./column-helpers";

// As lib/schemas/gauge-studies.ts had them when this shipped (a migration is history: no import).
const KINDS = ["type1", "grr"];

const dateOnly = (allowNull = false) => ({ type: DataTypes.DATEONLY, allowNull });

async function createStudies(qi: MigrationParams["context"]): Promise<void> {
  await qi.createTable(
    "gauge_studies",
    {
      id: intId(),
      shop_id: fk("shops", "CASCADE"),
      instrument_id: fk("instruments", "RESTRICT"),
      kind: enumOf(KINDS),
      performed_by: fk("users", "RESTRICT"),
      performed_on: dateOnly(),
      due_on: dateOnly(),
      // The gauge's unit and resolution when the study was taken: every figure below is in it.
      unit: varchar(8),
      resolution: decimal(12, 6, false),
      // The setting master of a type 1 study (expanded U at reference_k); none on an R&R study.
      reference_value: decimal(14, 6),
      reference_u: decimal(12, 6),
      reference_k: decimal(4, 2),
      // The R&R study's tolerance for %GRR against tolerance, when one was given.
      tolerance: decimal(14, 6),
      // Type 1: the readings in order; R&R: { appraiser, part, trial, value } each.
      measurements: { type: DataTypes.JSON, allowNull: false },
      // R&R: the appraisers' names in order (appraiser 1 is the first); null on a type 1 study.
      appraisers: { type: DataTypes.JSON, allowNull: true },
      mean: decimal(14, 6),
      repeat_sd: decimal(14, 8, false),
      bias: decimal(14, 8, false),
      grr_sd: decimal(14, 8),
      // Whether every characteristic judged when it was saved passed, for lists.
      passed: bool(false),
      // The thresholds it was judged by and the core's whole result.
      thresholds: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: false },
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("gauge_studies", ["instrument_id", "performed_on", "id"], { name: "gauge_studies_latest" });
  await qi.addIndex("gauge_studies", ["shop_id", "performed_on"], { name: "gauge_studies_shop" });
}

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await createStudies(qi);
  await qi.sequelize.query(
    "ALTER TABLE shops" +
      " ADD COLUMN study_min_cg DECIMAL(4,2) NOT NULL DEFAULT 1.33," +
      " ADD COLUMN study_min_cgk DECIMAL(4,2) NOT NULL DEFAULT 1.33," +
      " ADD COLUMN study_max_resolution_pct DECIMAL(5,2) NOT NULL DEFAULT 5.00," +
      " ADD COLUMN study_max_grr_pct DECIMAL(5,2) NOT NULL DEFAULT 30.00," +
      " ADD COLUMN study_valid_months INT NOT NULL DEFAULT 12",
  );
  await qi.sequelize.query(
    "ALTER TABLE instruments" +
      " ADD COLUMN master_label VARCHAR(120) NULL," +
      " ADD COLUMN master_size DECIMAL(12,6) NULL," +
      " ADD COLUMN master_u DECIMAL(12,6) NULL",
  );
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // Plain SQL: QueryInterface.removeColumn first runs an untyped raw SELECT for foreign keys, which
  // Sequelize 6 cannot read back from mariadb 3.x ("Cannot delete property 'meta'").
  await qi.sequelize.query(
    "ALTER TABLE instruments DROP COLUMN master_u, DROP COLUMN master_size, DROP COLUMN master_label",
  );
  await qi.sequelize.query(
    "ALTER TABLE shops DROP COLUMN study_valid_months, DROP COLUMN study_max_grr_pct," +
      " DROP COLUMN study_max_resolution_pct, DROP COLUMN study_min_cgk, DROP COLUMN study_min_cg",
  );
  await qi.dropTable("gauge_studies");
}
