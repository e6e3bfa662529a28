import "server-only";
import { Image, Text, View } from "@react-pdf/renderer";
import { FASTENER_CAUTION, VERDICT_WORDS } from "@/lib/domain";
import { Heading, KeyValues, SubHeading, Table, VerdictMark, type Column } from "@/lib/server/record/pdf-parts";
import { s } from "@/lib/server/record/pdf-styles";
import type { BuildRecord, DerivedLine, FlagLine, GaugeLine, ReadingLine, TorqueLine } from "@/lib/schemas/record";

// The body sections of the record PDF, in the order a builder reads them.

const byWhen = (r: { takenBy: string; takenAt: string }) => (
  <View>
    <Text>{r.takenBy}</Text>
    <Text style={[s.muted, s.small]}>{r.takenAt}</Text>
  </View>
);

const READING_COLUMNS: Column<ReadingLine>[] = [
  { title: "Station", width: "27%", cell: (r) => r.station },
  { title: "Value", width: "11%", cell: (r) => <Text style={s.bold}>{r.value || "-"}</Text> },
  { title: "Limits", width: "16%", cell: (r) => r.limits },
  { title: "Dev.", width: "7%", cell: (r) => r.deviation },
  { title: "Verdict", width: "12%", cell: (r) => <VerdictMark verdict={r.verdict} words={r.verdictWords} /> },
  { title: "Gauge", width: "11%", cell: (r) => r.gauge },
  { title: "Taken (UTC)", width: "16%", cell: byWhen },
];
const readingNote = (r: ReadingLine) => [r.notes, r.photos.join(", ")].filter(Boolean).join("; ");

const DERIVED_COLUMNS: Column<DerivedLine>[] = [
  { title: "Value computed", width: "20%", cell: (d) => d.what },
  { title: "Where", width: "17%", cell: (d) => d.station },
  { title: "Value", width: "11%", cell: (d) => <Text style={s.bold}>{d.value}</Text> },
  { title: "Limits", width: "15%", cell: (d) => d.limits },
  { title: "Dev.", width: "7%", cell: (d) => d.deviation },
  { title: "Verdict", width: "11%", cell: (d) => <VerdictMark verdict={d.verdict} words={d.verdictWords} /> },
  { title: "From", width: "19%", cell: (d) => d.from },
];

const TORQUE_COLUMNS: Column<TorqueLine>[] = [
  { title: "Fastener group", width: "18%", cell: (t) => t.station },
  { title: "Torque", width: "11%", cell: (t) => <Text style={s.bold}>{t.value}</Text> },
  { title: "Limits", width: "15%", cell: (t) => t.limits },
  { title: "Verdict", width: "11%", cell: (t) => <VerdictMark verdict={t.verdict} words={t.verdictWords} /> },
  { title: "Lubricant", width: "16%", cell: (t) => t.lubricant },
  { title: "Wrench", width: "15%", cell: (t) => t.gauge },
  { title: "Taken (UTC)", width: "14%", cell: byWhen },
];

const FLAG_COLUMNS: Column<FlagLine>[] = [
  {
    title: "Flagged",
    width: "25%",
    cell: (f) => (
      <View>
        <Text style={s.bold}>{f.what}</Text>
        <Text>{f.station}</Text>
      </View>
    ),
  },
  {
    title: "Value",
    width: "16%",
    cell: (f) => (
      <View>
        <Text>{f.value}</Text>
        <Text style={[s.muted, s.small]}>{f.limits}</Text>
      </View>
    ),
  },
  { title: "Verdict", width: "12%", cell: (f) => <VerdictMark verdict={f.verdict} words={VERDICT_WORDS[f.verdict]} /> },
  {
    title: "Why flagged, and what was decided",
    width: "47%",
    cell: (f) => (
      <View>
        <Text>{`Flagged: ${f.reason}. ${f.state}.`}</Text>
        {f.decisions.map((d, i) => (
          <Text key={i} style={s.small}>{`${d.when}${d.who ? `, ${d.who}` : ""}: ${d.words}`}</Text>
        ))}
      </View>
    ),
  },
];

const GAUGE_COLUMNS: Column<GaugeLine>[] = [
  { title: "Gauge", width: "30%", cell: (g) => g.label },
  { title: "Serial", width: "14%", cell: (g) => g.serial },
  { title: "Uncertainty", width: "28%", cell: (g) => g.uncertainty },
  {
    title: "Calibration",
    width: "28%",
    cell: (g) => (
      <Text style={g.pastDue ? s.bold : {}}>{g.pastDue ? `${g.calibration}: PAST DUE when used` : g.calibration}</Text>
    ),
  },
];

export function PlanSection({ plan }: { plan: BuildRecord["plan"] }) {
  if (!plan)
    return (
      <View>
        <Heading>Build plan</Heading>
        <Text style={s.muted}>No build plan was entered for this job.</Text>
      </View>
    );
  return (
    <View>
      <Heading>Build plan</Heading>
      <View style={s.row2}>
        <View style={s.col}>
          <SubHeading>As planned</SubHeading>
          <KeyValues lines={plan.entered} labelWidth={50} />
        </View>
        <View style={s.col}>
          <SubHeading>Figures computed from the plan</SubHeading>
          <KeyValues lines={plan.figures} labelWidth={42} />
          {plan.problems.map((p) => (
            <Text key={p} style={s.bold}>
              {p}
            </Text>
          ))}
        </View>
      </View>
      {plan.notes ? <Text style={{ marginTop: 4 }}>{`Notes: ${plan.notes}`}</Text> : null}
    </View>
  );
}

export function ReadingsSection({ record }: { record: BuildRecord }) {
  return (
    <View>
      <Heading>Bench readings</Heading>
      <Text style={[s.muted, { marginBottom: 4 }]}>
        The current reading of each station, as entered, with the limits it was judged against and the deviation from
        nominal. Corrected and re-measured readings are kept in the shop's history.
      </Text>
      {record.sections.length === 0 ? <Text>No readings were recorded.</Text> : null}
      {record.sections.map((sec) => (
        <View key={sec.id}>
          <SubHeading>{sec.label}</SubHeading>
          <Table columns={READING_COLUMNS} rows={sec.rows} note={readingNote} />
        </View>
      ))}
      <Heading>Derived values</Heading>
      {record.derived.length === 0 ? (
        <Text>No values could be computed from the readings.</Text>
      ) : (
        <Table columns={DERIVED_COLUMNS} rows={record.derived} />
      )}
    </View>
  );
}

export function TorqueSection({ rows }: { rows: TorqueLine[] }) {
  return (
    <View>
      <Heading>Fastener torque and lubricant</Heading>
      {rows.length === 0 ? <Text>No torque records.</Text> : <Table columns={TORQUE_COLUMNS} rows={rows} />}
      <View style={s.caution} wrap={false}>
        <Text style={s.bold}>CAUTION: FASTENERS</Text>
        <Text>{FASTENER_CAUTION}</Text>
      </View>
    </View>
  );
}

export function ReviewSections({ record }: { record: BuildRecord }) {
  return (
    <View>
      <Heading>Flags and decisions</Heading>
      {record.flags.length === 0 ? (
        <Text>No reading was flagged.</Text>
      ) : (
        <Table columns={FLAG_COLUMNS} rows={record.flags} />
      )}
      <Heading>Gauges used</Heading>
      {record.gauges.length === 0 ? (
        <Text>No gauge was recorded with the readings.</Text>
      ) : (
        <Table columns={GAUGE_COLUMNS} rows={record.gauges} />
      )}
    </View>
  );
}

export function PhotosSection({ record }: { record: BuildRecord }) {
  if (record.photos.length === 0) return null;
  return (
    <View>
      <Heading>Photos</Heading>
      <View style={s.photoGrid}>
        {record.photos.map((p) => (
          <View key={p.id} style={s.photo} wrap={false}>
            {p.thumb ? (
              <Image style={s.photoImg} src={{ data: p.thumb, format: "jpg" }} />
            ) : (
              <View style={s.photoImg} />
            )}
            <Text style={s.small}>{p.caption}</Text>
            <Text style={[s.small, s.muted]}>{p.note}</Text>
          </View>
        ))}
      </View>
    </View>
  );
}
