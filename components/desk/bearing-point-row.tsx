"use client";

import { VerdictBadge } from "@/components/ui/verdict-badge";
import { BEARING_ROLE_WORDS, lengthWords, type LengthUnit } from "@/lib/domain";
import type { BearingsView, PointProposal, PointView } from "@/lib/schemas/bearings";
import { clearanceWords, differenceWords, setName } from "@/lib/schemas/bearing-words";

// One bearing point in a row: what was measured, its housing bore (typed here), its window, the
// halves chosen (by the selection or by hand), the predicted clearance, and the measured one.

export type HousingDraft = {
  housingBore: string;
  housingGaugeId: string;
  thrust: boolean;
  /** The maker's grade marks stamped on the block or cap and on the crank, as read (a grade table's codes). */
  housingCode: string;
  journalCode: string;
};

const cell = "flex flex-col gap-1";
const ROW = [
  "grid gap-3 rounded-tool border-2 border-rule bg-panel p-3",
  "sm:grid-cols-2 lg:grid-cols-[9rem_1fr_1fr_1.4fr_1fr]",
].join(" ");
const label = "text-xs font-semibold uppercase tracking-wide text-muted";
const input = "min-h-11 w-full rounded-tool border-2 border-rule bg-paper px-2 font-mono tabular focus:border-steel";

function Figure({ value, unit }: { value: number | null | undefined; unit: LengthUnit }) {
  return <span className="font-mono tabular">{value == null ? "—" : lengthWords(value, unit)}</span>;
}

/** A grade mark as stamped (a number, a letter or a colour), kept to the column's 16 characters. */
function Mark(props: {
  what: string;
  point: PointView;
  value: string;
  disabled: boolean;
  onChange: (v: string) => void;
}) {
  const id = `${props.what.split(" ")[0].toLowerCase()}-mark-${props.point.point}`;
  return (
    <span className={cell}>
      <label className={label} htmlFor={id}>
        {props.what}
      </label>
      <input
        id={id}
        className={input}
        maxLength={16}
        autoComplete="off"
        disabled={props.disabled}
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
      />
    </span>
  );
}

export function BearingPointRow(props: {
  view: BearingsView;
  p: PointView;
  draft: HousingDraft;
  onDraft: (d: HousingDraft) => void;
  choice: PointProposal | undefined;
  onChoose: (half: "upperShellId" | "lowerShellId", id: number | null) => void;
}) {
  const { view, p, draft, onDraft, choice, onChoose } = props;
  const unit = view.job.unit;
  const role = p.point.startsWith("rod/") ? "rod" : draft.thrust ? "thrust" : "main";
  const sets = view.shells.filter((s) => s.role === role);
  const locked = view.job.locked;
  const predicted = choice?.predicted ?? null;
  const measured = p.measured;
  const pick = (half: "upperShellId" | "lowerShellId", name: string) => (
    <select
      aria-label={`${p.label} ${name} half`}
      className={input}
      disabled={locked}
      value={choice?.[half] ?? ""}
      onChange={(e) => onChoose(half, e.target.value ? Number(e.target.value) : null)}
    >
      <option value="">No half chosen</option>
      {sets.map((s) => (
        <option key={s.id} value={s.id}>
          #{s.id} {setName(s)}
        </option>
      ))}
    </select>
  );
  return (
    <li aria-label={p.label} className={ROW}>
      <div className={cell}>
        <span className="text-lg font-semibold">{p.label}</span>
        <span className="text-sm text-muted">{BEARING_ROLE_WORDS[role]} shells</span>
        {p.point.startsWith("main/") && (
          <label className="flex min-h-11 items-center gap-2 text-sm">
            <input
              type="checkbox"
              className="h-5 w-5 accent-steel"
              checked={draft.thrust}
              disabled={locked}
              onChange={(e) => onDraft({ ...draft, thrust: e.target.checked })}
            />
            Thrust main
          </label>
        )}
      </div>
      <div className={cell}>
        <span className={label}>Journal ({p.journalPart})</span>
        {p.journal ? (
          <span className="font-mono tabular">
            {lengthWords(p.journal.min, unit)} to {lengthWords(p.journal.max, unit)} · {p.journal.count} read
          </span>
        ) : (
          <span className="text-muted">Not measured yet</span>
        )}
        <span className={label}>Window</span>
        <span className="font-mono text-sm tabular">
          {p.window ? (
            <>
              <Figure value={p.window.min} unit={unit} /> to <Figure value={p.window.max} unit={unit} />, aim{" "}
              <Figure value={p.window.target} unit={unit} />
            </>
          ) : (
            "No oil clearance limit"
          )}
        </span>
      </div>
      <div className={cell}>
        <label className={label} htmlFor={`housing-${p.point}`}>
          Housing bore, no shells ({unit})
        </label>
        <input
          id={`housing-${p.point}`}
          className={input}
          inputMode="decimal"
          autoComplete="off"
          disabled={locked}
          value={draft.housingBore}
          onChange={(e) => onDraft({ ...draft, housingBore: e.target.value })}
        />
        <select
          aria-label={`${p.label} housing bore gauge`}
          className={input}
          disabled={locked}
          value={draft.housingGaugeId}
          onChange={(e) => onDraft({ ...draft, housingGaugeId: e.target.value })}
        >
          <option value="">Gauge (for its U)</option>
          {view.gauges.map((g) => (
            <option key={g.id} value={g.id}>
              {g.label}
            </option>
          ))}
        </select>
        <div className="grid grid-cols-2 gap-2">
          <Mark
            what="Housing mark"
            value={draft.housingCode}
            disabled={locked}
            point={p}
            onChange={(v) => onDraft({ ...draft, housingCode: v })}
          />
          <Mark
            what="Journal mark"
            value={draft.journalCode}
            disabled={locked}
            point={p}
            onChange={(v) => onDraft({ ...draft, journalCode: v })}
          />
        </div>
      </div>
      <div className={cell}>
        <span className={label}>Upper half ({role === "rod" ? "rod side" : "block side"})</span>
        {pick("upperShellId", "upper")}
        <span className={label}>Lower half (cap side)</span>
        {pick("lowerShellId", "lower")}
        {p.byHand && <span className="text-xs text-muted">Saved choice was changed by hand</span>}
      </div>
      <div className={cell}>
        <span className={label}>Predicted clearance</span>
        <span className="font-mono tabular" data-testid="predicted">
          {clearanceWords(predicted, unit)}
        </span>
        {predicted?.verdict && <VerdictBadge verdict={predicted.verdict} size="sm" />}
        <span className={label}>Measured installed</span>
        <span className="font-mono tabular">{clearanceWords(measured, unit)}</span>
        {measured?.verdict && <VerdictBadge verdict={measured.verdict} size="sm" />}
        {measured && p.predicted && (
          <span className="text-sm">
            Measured − predicted: {differenceWords(measured.value, p.predicted.value, unit)}
          </span>
        )}
      </div>
    </li>
  );
}
