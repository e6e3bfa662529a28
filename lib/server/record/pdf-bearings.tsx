import "server-only";
import { Text, View } from "@react-pdf/renderer";
import { Heading, Table, type Column } from "@/lib/server/record/pdf-parts";
import { s } from "@/lib/server/record/pdf-styles";
import type { BearingRecordLine } from "@/lib/schemas/record";

// The record's bearing selection: the halves chosen for each point and where each went, the
// clearance predicted for them (± its U, k = 2) and the clearance measured once installed.

const COLUMNS: Column<BearingRecordLine>[] = [
  { title: "Bearing", width: "13%", cell: (b) => <Text style={s.bold}>{b.point}</Text> },
  { title: "Upper half", width: "24%", cell: (b) => b.upper },
  { title: "Lower half", width: "24%", cell: (b) => b.lower },
  { title: "Predicted", width: "15%", cell: (b) => b.predicted },
  { title: "Measured", width: "12%", cell: (b) => b.measured },
  { title: "Difference", width: "12%", cell: (b) => b.difference },
];

export function BearingSection({ lines }: { lines: BearingRecordLine[] | undefined }) {
  if (!lines?.length) return null;
  return (
    <View>
      <Heading>Bearing shell selection</Heading>
      <Table columns={COLUMNS} rows={lines} />
      <Text style={[s.muted, s.small]}>
        Predicted: housing bore less both walls less the journal, before assembly. Measured: installed bore less journal
        at the bench. The engine and bearing maker&apos;s clearances govern.
      </Text>
    </View>
  );
}
