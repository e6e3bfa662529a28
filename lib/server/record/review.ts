import "server-only";
import { characteristicWords, instrumentKindWords, stationWords } from "@/lib/domain";
import type { GaugeStudySummary } from "@/lib/domain";
import { readingStudyProblem } from "@/lib/server/release/checklist-gauges";
import type { DispositionRow, InstrumentRow, JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { day, limitsText, when, withUnit } from "@/lib/server/record/format";
import type { DecisionLine, FlagLine, GaugeLine } from "@/lib/schemas/record";

// The reviewed part of the record: every flag with each decision about it (who, when, why), and
// the gauges the readings were taken with, with their calibration and their latest study.

const REASON_WORDS: Record<string, string> = {
  out_of_spec: "outside its limits",
  marginal: "within the gauge's uncertainty of a limit",
  gauge_past_due: "taken with a gauge past its calibration due date",
  gauge_study_failed: "taken with a gauge whose latest study fails for this tolerance",
  gauge_study_due: "taken with a gauge whose study was past its due date",
};

const STATE_WORDS: Record<string, string> = {
  open: "Open: no decision yet",
  disposed: "Decided",
  closed: "Closed by a newer reading in spec",
};

/**
 * A decision as the customer reads it. An acceptance prints its reason (why the value is fit to
 * use); a measure- or machine-again keeps its words in the shop: they are the lead's note to the
 * machinist at the bench, never part of the customer's record.
 */
function decisionWords(d: Pick<DispositionRow, "disposition" | "operation" | "reason">): string {
  if (d.disposition === "accept") return `Accepted as is${d.reason ? `. Reason: ${d.reason}` : ""}`;
  if (d.disposition === "machine_again") return `Machine again${d.operation ? ` (${d.operation})` : ""}`;
  return "Measure again";
}

export function flagLines(record: JobRecord, names: Map<number, string>): FlagLine[] {
  const byFlag = new Map<number, DispositionRow[]>();
  for (const d of record.dispositions) byFlag.set(d.flagId, [...(byFlag.get(d.flagId) ?? []), d]);
  return record.flags.map((f) => {
    const history = byFlag.get(f.id) ?? [];
    // Flags decided before dispositions were kept as history still show their latest decision.
    const rows = history.length
      ? history
      : f.disposition
        ? [
            {
              disposition: f.disposition,
              operation: f.operation ?? null,
              reason: f.dispositionReason ?? null,
              userId: f.disposedBy ?? 0,
              createdAt: f.disposedAt ?? f.updatedAt,
            },
          ]
        : [];
    const decisions: DecisionLine[] = rows.map((d) => ({
      when: when(d.createdAt),
      who: names.get(d.userId) ?? "",
      words: decisionWords(d),
    }));
    if (f.state === "closed" && f.closedAt)
      decisions.push({ when: when(f.closedAt), who: "", words: "Closed: a newer reading at this station is in spec" });
    return {
      id: f.id,
      station: stationWords(f.stationId),
      what: characteristicWords(f.characteristic),
      value: withUnit(f.value, f.unit),
      limits: limitsText(f.limitMin, f.limitMax, f.unit),
      verdict: f.verdict,
      reason: REASON_WORDS[f.reason] ?? f.reason,
      state: STATE_WORDS[f.state] ?? f.state,
      decisions,
    };
  });
}

function uncertaintyWords(g: InstrumentRow): string {
  const k = Number(g.coverageK ?? 2);
  return `U = ${withUnit(g.expandedU, g.unit)} (k = ${k}), reads to ${withUnit(g.resolution, g.unit)}`;
}

const STUDY_WORDS = { type1: "Repeatability study", grr: "R&R study" } as const;

/**
 * A gauge's latest study as the record prints it: kind, date, the spread it found, due date, and
 * whether it stood behind every reading taken with the gauge (the release checklist's own rule).
 */
function studyLine(g: InstrumentRow, study: GaugeStudySummary | undefined, readings: StoredReading[]) {
  if (!study) return { study: "No study on file: the certificate's U alone", studyProblem: false };
  const sd = study.kind === "grr" ? (study.grrSd ?? study.repeatSd) : study.repeatSd;
  const base =
    `${STUDY_WORDS[study.kind]} of ${study.performedOn} (${study.kind === "grr" ? "GRR" : "s"} = ` +
    `${withUnit(sd, g.unit)}), due ${study.dueOn}`;
  const problems = [
    ...new Set(readings.map((r) => readingStudyProblem(r, g, study)?.words).filter((w): w is string => !!w)),
  ];
  if (problems.length === 0) return { study: `${base}: stands for every reading`, studyProblem: false };
  const more = problems.length > 1 ? ` (and ${problems.length - 1} more)` : "";
  return { study: `${base}. The gauge ${problems[0]}${more}`, studyProblem: true };
}

/** Gauges used for current readings; past due when any of them was taken after the due date. */
export function gaugeLines(record: JobRecord, current: StoredReading[]): GaugeLine[] {
  const used = new Map<number, StoredReading[]>();
  for (const r of current) if (r.instrumentId) used.set(r.instrumentId, [...(used.get(r.instrumentId) ?? []), r]);
  return record.instruments
    .filter((g) => used.has(g.id))
    .map((g) => {
      const readings = used.get(g.id) ?? [];
      const due = g.calibrationDue ?? null;
      const pastDue = !!due && readings.some((r) => day(r.takenAt) > due);
      const calibration =
        g.calibratedOn || due
          ? `calibrated ${g.calibratedOn ?? "(date not recorded)"}, due ${due ?? "(not set)"}`
          : "no calibration recorded";
      return {
        label: g.label,
        serial: g.serial,
        kind: instrumentKindWords(g.kind),
        uncertainty: uncertaintyWords(g),
        calibration,
        pastDue,
        ...studyLine(
          g,
          record.studies.get(g.id),
          readings.filter((r) => !r.skipped),
        ),
      };
    });
}
