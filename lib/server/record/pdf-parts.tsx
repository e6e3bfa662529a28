import "server-only";
import { Path, Rect, Circle, Svg, Text, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import type { Verdict } from "@/lib/domain";
import type { Line } from "@/lib/schemas/record";
import { s, VERDICT_COLOUR } from "@/lib/server/record/pdf-styles";

// Small building blocks of the record PDF: the verdict mark (the app's shapes: a round dot in
// spec, a diamond when marginal, a square with a cross when out of spec), tables and key/value lists.

export function VerdictShape({ verdict, size = 7 }: { verdict: Verdict; size?: number }) {
  const c = VERDICT_COLOUR[verdict];
  return (
    <Svg width={size} height={size} viewBox="0 0 16 16">
      {verdict === "in_spec" ? <Circle cx="8" cy="8" r="6.5" fill={c} /> : null}
      {verdict === "marginal" ? <Path d="M8 0.8 L15.2 8 L8 15.2 L0.8 8 Z" fill={c} /> : null}
      {verdict === "out_of_spec" ? <Rect x="1" y="1" width="14" height="14" fill={c} /> : null}
      {verdict === "out_of_spec" ? (
        <Path d="M4.5 4.5 L11.5 11.5 M11.5 4.5 L4.5 11.5" stroke="#ffffff" strokeWidth={2.4} />
      ) : null}
    </Svg>
  );
}

/** Shape and word together; a row without a verdict says why in words ("Skipped", "No limit"). */
export function VerdictMark({ verdict, words }: { verdict: Verdict | null; words: string }) {
  if (!verdict) return <Text style={s.muted}>{words}</Text>;
  return (
    <View style={s.verdict}>
      <VerdictShape verdict={verdict} />
      <Text style={[s.bold, { color: VERDICT_COLOUR[verdict] }]}>{words.toUpperCase()}</Text>
    </View>
  );
}

export type Column<T> = { title: string; width: string; cell: (row: T) => ReactNode };

function cellContent(content: ReactNode) {
  return typeof content === "string" || typeof content === "number" ? <Text>{content}</Text> : content;
}

/**
 * A table whose header repeats on each page and whose rows never split across pages; `note`
 * gives a row an optional full-width line below its cells (notes, photos).
 */
export function Table<T>({ columns, rows, note }: { columns: Column<T>[]; rows: T[]; note?: (row: T) => string }) {
  return (
    <View style={s.table}>
      <View style={s.th} fixed minPresenceAhead={24}>
        {columns.map((c) => (
          <Text key={c.title} style={[s.cell, { width: c.width }]}>
            {c.title}
          </Text>
        ))}
      </View>
      {rows.map((row, i) => (
        <View key={i} style={s.tr} wrap={false}>
          <View style={s.trCells}>
            {columns.map((c) => (
              <View key={c.title} style={[s.cell, { width: c.width }]}>
                {cellContent(c.cell(row))}
              </View>
            ))}
          </View>
          {note && note(row) ? <Text style={s.trNote}>{note(row)}</Text> : null}
        </View>
      ))}
    </View>
  );
}

export function KeyValues({ lines, labelWidth = 32 }: { lines: Line[]; labelWidth?: number }) {
  return (
    <View>
      {lines.map((l) => (
        <View key={l.label} style={s.kv} wrap={false}>
          <Text style={[s.kvLabel, { width: `${labelWidth}%` }]}>{l.label}</Text>
          <Text style={[s.kvValue, { width: `${100 - labelWidth}%`, paddingLeft: 4 }]}>{l.value}</Text>
        </View>
      ))}
    </View>
  );
}

/** A section heading that is never left alone at the foot of a page. */
export function Heading({ children }: { children: ReactNode }) {
  return (
    <Text style={s.h2} minPresenceAhead={90}>
      {children}
    </Text>
  );
}

export function SubHeading({ children }: { children: ReactNode }) {
  return (
    <Text style={s.h3} minPresenceAhead={80}>
      {children}
    </Text>
  );
}
