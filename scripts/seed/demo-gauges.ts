// DEMO DATA ONLY: the demo shop's gauges, invented names, serials and certificate figures. Each has a
// measuring range, and together they give every station of the three demo engines a gauge of a
// suitable kind whose range holds its sizes (lib/domain/gauge-range.ts): micrometers for the
// journals and skirts of all three, bore gauges for bores and bearing bores, feelers for the gaps,
// a dial indicator for end play, a stretch gauge, a deck-height gauge and a torque wrench in each
// unit (the diesel's damper bolt, 200–220 N·m, is past the inch wrench's 150 lbf·ft = 203 N·m).
type DemoGauge = {
  key: string;
  kind: string;
  label: string;
  serial: string;
  unit: "in" | "mm" | "lbf_ft" | "nm";
  resolution: number;
  expandedU: number;
  rangeMin: number;
  rangeMax: number;
  calibratedOn: string;
  calibrationDue: string;
  /** The setting master a repeatability study of this gauge measures (invented figures, U at k = 2). */
  master?: { label: string; size: number; expandedU: number };
};

const year = (from: string) => ({
  calibratedOn: from,
  calibrationDue: `${Number(from.slice(0, 4)) + 1}${from.slice(4)}`,
});
const inchMic = (key: string, min: number, serial: string): DemoGauge => ({
  key,
  kind: "outside_mic",
  label: `Outside micrometer ${min}–${min + 1} in`,
  serial,
  unit: "in",
  resolution: 0.0001,
  expandedU: min < 3 ? 0.00008 : 0.0001,
  rangeMin: min,
  rangeMax: min + 1,
  ...year("2026-05-12"),
});
const mmMic = (key: string, min: number, serial: string): DemoGauge => ({
  key,
  kind: "outside_mic",
  label: `Outside micrometer ${min}–${min + 25} mm`,
  serial,
  unit: "mm",
  resolution: 0.001,
  expandedU: 0.002,
  rangeMin: min,
  rangeMax: min + 25,
  ...year("2026-07-20"),
});

export const DEMO_GAUGES: DemoGauge[] = [
  inchMic("mic", 2, "KF-M23-01"),
  inchMic("mic34", 3, "KF-M34-02"),
  inchMic("mic45", 4, "KF-M45-03"),
  mmMic("micMm50", 50, "KF-MM-10"),
  mmMic("micMm", 75, "KF-MM-11"),
  mmMic("micMm100", 100, "KF-MM-12"),
  {
    key: "dialBore",
    kind: "bore_gauge_dial",
    label: "Dial bore gauge 2–6 in",
    serial: "KF-DB-07",
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.00015,
    rangeMin: 2,
    rangeMax: 6,
    calibratedOn: "2026-03-02",
    calibrationDue: "2026-12-15",
    // Its setting ring, which a repeatability study measures. KF-2611's bores read 4.0302 in, 0.0002 in
    // inside the upper limit: a study whose repeatability is worse than the certificate's U widens the
    // guard band past them, so they turn marginal.
    master: { label: "Setting ring 4.0300 in, KF-SR-40", size: 4.03, expandedU: 0.00005 },
  },
  {
    key: "boreMm",
    kind: "bore_gauge_digital",
    label: "Digital bore gauge 50–160 mm",
    serial: "KF-DBM-03",
    unit: "mm",
    resolution: 0.001,
    expandedU: 0.003,
    rangeMin: 50,
    rangeMax: 160,
    ...year("2026-07-20"),
  },
  {
    key: "indicator",
    kind: "dial_indicator",
    label: "Dial indicator 1 in travel",
    serial: "KF-DI-04",
    unit: "in",
    resolution: 0.0005,
    expandedU: 0.0004,
    rangeMin: 0,
    rangeMax: 1,
    // Past its due date on purpose: the demo's end play is flagged for it.
    calibratedOn: "2025-09-01",
    calibrationDue: "2026-09-01",
  },
  {
    key: "feeler",
    kind: "feeler",
    label: "Feeler gauge set 0.0015–0.040 in",
    serial: "KF-FG-05",
    unit: "in",
    resolution: 0.0005,
    expandedU: 0.0002,
    rangeMin: 0.0015,
    rangeMax: 0.04,
    ...year("2026-06-15"),
  },
  {
    key: "feelerMm",
    kind: "feeler",
    label: "Feeler gauge set 0.03–1.00 mm",
    serial: "KF-FG-06",
    unit: "mm",
    resolution: 0.01,
    expandedU: 0.005,
    rangeMin: 0.03,
    rangeMax: 1,
    ...year("2026-06-15"),
  },
  {
    key: "stretch",
    kind: "stretch_gauge",
    label: "Rod-bolt stretch gauge",
    serial: "KF-SG-02",
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.0001,
    rangeMin: 0.5,
    rangeMax: 6,
    ...year("2026-04-04"),
  },
  {
    key: "deck",
    kind: "deck_gauge",
    label: "Deck height gauge 6–16 in",
    serial: "KF-DH-08",
    unit: "in",
    resolution: 0.0005,
    expandedU: 0.0005,
    rangeMin: 6,
    rangeMax: 16,
    ...year("2026-04-04"),
  },
  {
    key: "torque",
    kind: "torque_wrench",
    label: "Click torque wrench 20–150 lbf·ft",
    serial: "KF-TW-09",
    unit: "lbf_ft",
    resolution: 1,
    expandedU: 2,
    rangeMin: 20,
    rangeMax: 150,
    ...year("2026-02-10"),
  },
  {
    key: "torqueNm",
    kind: "torque_wrench",
    label: "Click torque wrench 60–340 N·m",
    serial: "KF-TW-14",
    unit: "nm",
    resolution: 1,
    expandedU: 3,
    rangeMin: 60,
    rangeMax: 340,
    ...year("2026-02-10"),
  },
];

/** A demo gauge as the instruments table keeps it (the setting master in its own columns). */
export function demoGaugeRow({ key: _key, master, ...g }: DemoGauge) {
  return {
    ...g,
    masterLabel: master?.label ?? null,
    masterSize: master?.size ?? null,
    masterU: master?.expandedU ?? null,
  };
}
