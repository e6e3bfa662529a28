import "server-only";
import { Document, Page, Text, View } from "@react-pdf/renderer";
import { COMMON_PRACTICE_WORDS, verdictInText } from "@/lib/domain";
import { plural } from "@/lib/server/record/format";
import { Heading, KeyValues, VerdictShape } from "@/lib/server/record/pdf-parts";
import {
  PhotosSection,
  PlanSection,
  ReadingsSection,
  ReviewSections,
  TorqueSection,
} from "@/lib/server/record/pdf-sections";
import { BearingSection } from "@/lib/server/record/pdf-bearings";
import { footerTop, s, VERDICT_COLOUR } from "@/lib/server/record/pdf-styles";
import type { BuildRecord, ReleaseStamp } from "@/lib/schemas/record";

// The build record as a PDF document (our own layout). Page one carries who, what, the release
// stamp with its fingerprint, the tally and the safety notice; the detail follows.

function stateWords(r: BuildRecord): { mark: string; words: string } {
  if (!r.release)
    return {
      mark: "DRAFT",
      words: "DRAFT: NOT RELEASED. This job has not been signed off by an inspector; figures may still change.",
    };
  if (r.release.status === "void")
    return {
      mark: "VOID",
      words:
        `VOID: this release was withdrawn on ${r.release.voidedAt}${r.release.voidedByName ? ` by ${r.release.voidedByName}` : ""}. ` +
        `Reason: ${r.release.voidReason ?? "none given"}. Do not assemble from this record. ` +
        "When the job is released again, the shop sends a new record.",
    };
  return { mark: "", words: "RELEASED FOR ASSEMBLY" };
}

function ReleaseBox({ record }: { record: BuildRecord }) {
  const r = record.release;
  const state = stateWords(record);
  return (
    <View style={r && r.status === "standing" ? s.releaseBox : s.voidBox} wrap={false}>
      <Text style={[s.bold, { fontSize: r?.status === "standing" ? 13 : 11 }]}>{state.words}</Text>
      {r ? (
        <View style={{ marginTop: 4 }}>
          <Text>{`Signed by ${r.inspectorName}, inspector, on ${r.signedAt}.`}</Text>
          <Text style={{ marginTop: 3 }}>
            Fingerprint (SHA-256 of the released readings, limits, decisions and gauges):
          </Text>
          <Text style={s.mono}>{r.hash}</Text>
          <Text style={[s.small, { marginTop: 3 }]}>{`Check when this copy was made: ${r.check.words}`}</Text>
          <Text style={[s.small, s.muted]}>{`Anyone can check it again at ${r.verifyUrl}`}</Text>
        </View>
      ) : null}
    </View>
  );
}

function Tally({ record }: { record: BuildRecord }) {
  const t = record.tally;
  const items = [
    { verdict: "in_spec" as const, n: t.inSpec, words: verdictInText("in_spec") },
    { verdict: "marginal" as const, n: t.marginal, words: verdictInText("marginal") },
    { verdict: "out_of_spec" as const, n: t.outOfSpec, words: `${verdictInText("out_of_spec")} (see decisions)` },
  ];
  return (
    <View style={s.box} wrap={false}>
      <Text
        style={s.bold}
      >{`${plural(t.measured, "station")} measured${t.skipped ? `, ${t.skipped} skipped` : ""}${t.unjudged ? `, ${t.unjudged} with no limit` : ""}; ${plural(record.derived.length, "value")} computed; ${plural(record.flags.length, "flag")}.`}</Text>
      <View style={[s.row2, { marginTop: 4 }]}>
        {items.map((i) => (
          <View key={i.verdict} style={s.verdict}>
            <VerdictShape verdict={i.verdict} size={9} />
            <Text style={{ color: VERDICT_COLOUR[i.verdict] }}>{`${i.n} ${i.words}`}</Text>
          </View>
        ))}
      </View>
    </View>
  );
}

function Signature({ record }: { record: BuildRecord }) {
  const r = record.release;
  return (
    <View wrap={false}>
      <Heading>Release</Heading>
      {r ? (
        <View>
          <Text style={s.signLine}>{r.inspectorName}</Text>
          <Text>{`E-signature of ${r.inspectorName}, inspector, given with their password on ${r.signedAt}.${r.status === "void" ? " THIS RELEASE IS VOID." : ""}`}</Text>
          <Text style={[s.mono, { marginTop: 3 }]}>{`SHA-256 ${r.hash} (record format v${r.canonicalVersion})`}</Text>
        </View>
      ) : (
        <Text>Not released: no inspector has signed this record.</Text>
      )}
      {record.earlierReleases.map((e: ReleaseStamp) => (
        <Text
          key={e.id}
          style={[s.small, { marginTop: 3 }]}
        >{`Earlier release signed by ${e.inspectorName} on ${e.signedAt}: ${e.status === "void" ? `VOID since ${e.voidedAt}. Reason: ${e.voidReason ?? "none given"}` : "standing"}.`}</Text>
      ))}
    </View>
  );
}

function Cover({ record }: { record: BuildRecord }) {
  return (
    <View>
      <Text style={s.title}>Build record</Text>
      <Text style={s.subtitle}>{`${record.job.code} · ${record.job.title}`}</Text>
      <ReleaseBox record={record} />
      <View style={s.row2}>
        <View style={[s.col, s.box]}>
          <Text style={s.bold}>Shop</Text>
          <Text>{record.shop.name}</Text>
          {record.shop.contact.map((c) => (
            <Text key={c}>{c}</Text>
          ))}
        </View>
        <View style={[s.col, s.box]}>
          <Text style={s.bold}>Customer</Text>
          <Text>{record.customer.name}</Text>
          {record.customer.contact.map((c) => (
            <Text key={c}>{c}</Text>
          ))}
        </View>
      </View>
      <KeyValues
        lines={[
          ...record.engine,
          { label: "Units", value: record.job.units },
          { label: "Spec sheet revision", value: String(record.job.specRevision) },
        ]}
      />
      <View style={{ marginTop: 6 }}>
        <Tally record={record} />
      </View>
      {record.commonPractice.length > 0 && (
        <View style={s.caution} wrap={false}>
          <Text style={s.bold}>LIMITS AT TYPICAL FIGURES</Text>
          <Text style={{ marginTop: 2 }}>
            {COMMON_PRACTICE_WORDS}: {record.commonPractice.join("; ")}.
          </Text>
        </View>
      )}
      <View style={s.caution} wrap={false}>
        <Text style={s.bold}>SAFETY NOTICE</Text>
        {record.safety.map((line) => (
          <Text key={line} style={{ marginTop: 2 }}>
            {line}
          </Text>
        ))}
      </View>
    </View>
  );
}

export function RecordDocument({ record }: { record: BuildRecord }) {
  const mark = stateWords(record).mark;
  const fingerprint = record.release ? `fingerprint ${record.release.hash.slice(0, 16)}…` : "not released";
  return (
    <Document
      title={`Build record ${record.job.code}`}
      author={record.shop.name}
      subject={record.job.title}
      creator="Tenthwise"
      producer="Tenthwise"
    >
      <Page size={record.pageSize} style={s.page} wrap>
        <View style={s.header} fixed>
          <Text>{`Tenthwise build record · ${record.job.code}${mark ? ` · ${mark}` : ""}`}</Text>
          <Text>{record.shop.name}</Text>
        </View>
        {mark ? (
          <Text style={s.watermark} fixed>
            {mark}
          </Text>
        ) : null}
        <Cover record={record} />
        <PlanSection plan={record.plan} />
        <BearingSection lines={record.bearings} />
        <ReadingsSection record={record} />
        <TorqueSection rows={record.torque} />
        <ReviewSections record={record} />
        <PhotosSection record={record} />
        <Signature record={record} />
        <View style={[s.footer, footerTop(record.pageSize)]} fixed>
          <Text>{`Made ${record.generatedAt} · ${fingerprint}`}</Text>
        </View>
        {/* On its own: a render() text inside a View gets no page numbers. */}
        <Text
          style={[s.pageNumber, footerTop(record.pageSize)]}
          fixed
          render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`}
        />
      </Page>
    </Document>
  );
}
