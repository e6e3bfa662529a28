import "server-only";
import { col, userName, type ArchiveFile } from "./columns";

// The shop archive's gauge files: the gauges with their setting masters, and every gauge study as it
// was kept (its raw figures, the marks it was judged by and the core's whole result as JSON).
// docs/archive-format.md describes them; a column added here is added there.

export const GAUGES: ArchiveFile = {
  name: "gauges.csv",
  from: "instruments x",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("gauge id", "x.id", "number"),
    col("kind", "x.kind"),
    col("name", "x.label"),
    col("serial", "x.serial"),
    col("unit", "x.unit"),
    col("resolution", "x.resolution", "number"),
    col("expanded uncertainty U", "x.expanded_u", "number"),
    col("coverage factor k", "x.coverage_k", "number"),
    col("range from", "x.range_min", "number"),
    col("range to", "x.range_max", "number"),
    col("calibrated on", "x.calibrated_on", "date"),
    col("calibration due", "x.calibration_due", "date"),
    col("plus on the dial means a smaller bore", "x.dial_plus_means_smaller", "bool"),
    col("active", "x.active", "bool"),
    col("setting master", "x.master_label"),
    col("setting master size", "x.master_size", "number"),
    col("setting master U (k = 2)", "x.master_u", "number"),
    col("created at (UTC)", "x.created_at", "time"),
  ],
};

export const GAUGE_STUDIES: ArchiveFile = {
  name: "gauge-studies.csv",
  from: "gauge_studies x JOIN instruments g ON g.id = x.instrument_id",
  shopColumn: "x.shop_id",
  key: ["x.id"],
  columns: [
    col("study id", "x.id", "number"),
    col("gauge id", "x.instrument_id", "number"),
    col("gauge serial", "g.serial"),
    col("kind", "x.kind"),
    col("performed by (person id)", "x.performed_by", "number"),
    col("performed by", userName("x.performed_by")),
    col("performed on", "x.performed_on", "date"),
    col("due on", "x.due_on", "date"),
    col("unit", "x.unit"),
    col("resolution", "x.resolution", "number"),
    col("reference value", "x.reference_value", "number"),
    col("reference U", "x.reference_u", "number"),
    col("reference k", "x.reference_k", "number"),
    col("tolerance", "x.tolerance", "number"),
    col("passed", "x.passed", "bool"),
    col("mean", "x.mean", "number"),
    col("repeatability s", "x.repeat_sd", "number"),
    col("bias", "x.bias", "number"),
    col("GRR s", "x.grr_sd", "number"),
    col("measurements (JSON)", "x.measurements", "json"),
    col("appraisers (JSON)", "x.appraisers", "json"),
    col("pass marks (JSON)", "x.thresholds", "json"),
    col("result (JSON)", "x.result", "json"),
    col("saved at (UTC)", "x.created_at", "time"),
  ],
};
