import "server-only";
import { FASTENER_CAUTION, VERDICT_WORDS } from "@/lib/domain";
import type { Canvas, Column, Piece } from "@/lib/server/record/pdf-canvas";
import { F, MUTED, RULE } from "@/lib/server/record/pdf-styles";
import type {
  BuildRecord,
  DerivedLine,
  FlagLine,
  GaugeLine,
  Line,
  ReadingLine,
  TorqueLine,
} from "@/lib/schemas/record";

// The body sections of the record PDF, in the order a builder reads them.

const T = F.table;
const bold = (text: string): Piece[] => [{ text, font: F.bold, size: T }];
const byWhen = (r: { takenBy: string; takenAt: string }): Piece[] => [
  { text: r.takenBy, size: T },
  { text: r.takenAt, size: 7, colour: MUTED },
];

const READING_COLUMNS: Column<ReadingLine>[] = [
  { title: "Station", width: 27, cell: (r) => [{ text: r.station, size: T }] },
  { title: "Value", width: 11, cell: (r) => bold(r.value || "-") },
  { title: "Limits", width: 16, cell: (r) => [{ text: r.limits, size: T }] },
  { title: "Dev.", width: 7, cell: (r) => [{ text: r.deviation, size: T }] },
  { title: "Verdict", width: 12, cell: (r) => ({ verdict: r.verdict, words: r.verdictWords }) },
  { title: "Gauge", width: 11, cell: (r) => [{ text: r.gauge, size: T }] },
  { title: "Taken (UTC)", width: 16, cell: byWhen },
];
const readingNote = (r: ReadingLine) => [r.notes, r.photos.join(", ")].filter(Boolean).join("; ");

const DERIVED_COLUMNS: Column<DerivedLine>[] = [
  { title: "Value computed", width: 20, cell: (d) => [{ text: d.what, size: T }] },
  { title: "Where", width: 17, cell: (d) => [{ text: d.station, size: T }] },
  { title: "Value", width: 11, cell: (d) => bold(d.value) },
  { title: "Limits", width: 15, cell: (d) => [{ text: d.limits, size: T }] },
  { title: "Dev.", width: 7, cell: (d) => [{ text: d.deviation, size: T }] },
  { title: "Verdict", width: 11, cell: (d) => ({ verdict: d.verdict, words: d.verdictWords }) },
  { title: "From", width: 19, cell: (d) => [{ text: d.from, size: T }] },
];

const TORQUE_COLUMNS: Column<TorqueLine>[] = [
  { title: "Fastener group", width: 18, cell: (t) => [{ text: t.station, size: T }] },
  { title: "Torque", width: 11, cell: (t) => bold(t.value) },
  { title: "Limits", width: 15, cell: (t) => [{ text: t.limits, size: T }] },
  { title: "Verdict", width: 11, cell: (t) => ({ verdict: t.verdict, words: t.verdictWords }) },
  { title: "Lubricant", width: 16, cell: (t) => [{ text: t.lubricant, size: T }] },
  { title: "Wrench", width: 15, cell: (t) => [{ text: t.gauge, size: T }] },
  { title: "Taken (UTC)", width: 14, cell: byWhen },
];

const FLAG_COLUMNS: Column<FlagLine>[] = [
  { title: "Flagged", width: 25, cell: (f) => [...bold(f.what), { text: f.station, size: T }] },
  {
    title: "Value",
    width: 16,
    cell: (f) => [
      { text: f.value, size: T },
      { text: f.limits, size: 7, colour: MUTED },
    ],
  },
  { title: "Verdict", width: 12, cell: (f) => ({ verdict: f.verdict, words: VERDICT_WORDS[f.verdict] }) },
  {
    title: "Why flagged, and what was decided",
    width: 47,
    cell: (f) => [
      { text: `Flagged: ${f.reason}. ${f.state}.`, size: T },
      ...f.decisions.map((d) => ({ text: `${d.when}${d.who ? `, ${d.who}` : ""}: ${d.words}`, size: 7 })),
    ],
  },
];

const GAUGE_COLUMNS: Column<GaugeLine>[] = [
  { title: "Gauge", width: 18, cell: (g) => [{ text: g.label, size: T }] },
  { title: "Serial", width: 11, cell: (g) => [{ text: g.serial, size: T }] },
  { title: "Uncertainty", width: 21, cell: (g) => [{ text: g.uncertainty, size: T }] },
  {
    title: "Calibration",
    width: 20,
    cell: (g) => (g.pastDue ? bold(`${g.calibration}: PAST DUE when used`) : [{ text: g.calibration, size: T }]),
  },
  {
    title: "Latest study",
    width: 30,
    cell: (g) => (g.studyProblem ? bold(g.study) : [{ text: g.study, size: T }]),
  },
];

/** Label and value side by side, one line after the other; returns the height drawn. */
export function keyValues(c: Canvas, lines: Line[], x: number, w: number, labelShare = 0.32, y = c.y): number {
  let at = y;
  for (const l of lines) {
    const lw = w * labelShare;
    const h = Math.max(
      c.drawPieces([{ text: l.label, colour: MUTED }], x, at, lw - 4),
      c.drawPieces([{ text: l.value }], x + lw, at, w - lw),
    );
    at += h + 1.5;
  }
  return at - y;
}

export function planSection(c: Canvas, plan: BuildRecord["plan"]): void {
  c.heading("Build plan");
  if (!plan) return c.text([{ text: "No build plan was entered for this job.", colour: MUTED }]);
  const half = (c.width - 12) / 2;
  const rows = Math.max(plan.entered.length, plan.figures.length + plan.problems.length);
  c.ensure(rows * 12 + 20);
  const top = c.y;
  const sub = (t: string, x: number) => c.drawPieces([{ text: t, font: F.bold, size: 9.5 }], x, top + 5, half);
  sub("As planned", c.left);
  sub("Figures computed from the plan", c.left + half + 12);
  const left = keyValues(c, plan.entered, c.left, half, 0.5, top + 20);
  let right = keyValues(c, plan.figures, c.left + half + 12, half, 0.42, top + 20);
  for (const p of plan.problems)
    right += c.drawPieces([{ text: p, font: F.bold }], c.left + half + 12, top + 20 + right, half);
  c.y = top + 20 + Math.max(left, right) + 4;
  if (plan.notes) c.text(`Notes: ${plan.notes}`);
}

export function readingsSection(c: Canvas, record: BuildRecord): void {
  c.heading("Bench readings");
  c.text(
    [
      {
        text:
          "The current reading of each station, as entered, with the limits it was judged against and the deviation " +
          "from nominal. Corrected and re-measured readings are kept in the shop's history.",
        colour: MUTED,
      },
    ],
    4,
  );
  if (record.sections.length === 0) c.text("No readings were recorded.");
  for (const sec of record.sections) {
    c.subHeading(sec.label);
    c.table(READING_COLUMNS, sec.rows, readingNote);
  }
  c.heading("Derived values");
  if (record.derived.length === 0) c.text("No values could be computed from the readings.");
  else c.table(DERIVED_COLUMNS, record.derived);
}

export function torqueSection(c: Canvas, rows: TorqueLine[]): void {
  c.heading("Fastener torque and lubricant");
  if (rows.length === 0) c.text("No torque records.");
  else c.table(TORQUE_COLUMNS, rows);
  c.y += c.box([{ text: "CAUTION: FASTENERS", font: F.bold }, { text: FASTENER_CAUTION }], "caution") + 6;
}

export function reviewSections(c: Canvas, record: BuildRecord): void {
  c.heading("Flags and decisions");
  if (record.flags.length === 0) c.text("No reading was flagged.");
  else c.table(FLAG_COLUMNS, record.flags);
  c.heading("Gauges used");
  if (record.gauges.length === 0) c.text("No gauge was recorded with the readings.");
  else c.table(GAUGE_COLUMNS, record.gauges);
}

const PHOTO = { w: 124, h: 93, gap: 8 };

export function photosSection(c: Canvas, record: BuildRecord): void {
  if (record.photos.length === 0) return;
  c.heading("Photos", PHOTO.h + 30);
  const perRow = Math.max(1, Math.floor((c.width + PHOTO.gap) / (PHOTO.w + PHOTO.gap)));
  for (let i = 0; i < record.photos.length; i += perRow) {
    const row = record.photos.slice(i, i + perRow);
    const captions = row.map((p): Piece[] => [
      { text: p.caption, size: F.small },
      { text: p.note, size: F.small, colour: MUTED },
    ]);
    const h = PHOTO.h + 2 + Math.max(...captions.map((cp) => c.textHeight(cp, PHOTO.w)));
    c.ensure(h + 6);
    row.forEach((p, k) => {
      const x = c.left + k * (PHOTO.w + PHOTO.gap);
      c.doc.rect(x, c.y, PHOTO.w, PHOTO.h).fillColor("#f0f0ee").fill();
      if (p.thumb) c.doc.image(p.thumb, x, c.y, { fit: [PHOTO.w, PHOTO.h], align: "center", valign: "center" });
      c.doc.rect(x, c.y, PHOTO.w, PHOTO.h).lineWidth(0.5).strokeColor(RULE).stroke();
      c.drawPieces(captions[k], x, c.y + PHOTO.h + 2, PHOTO.w);
    });
    c.y += h + 6;
  }
}
