"use client";

import { memo, useState } from "react";
import { gaugeRangeWords, unitWords } from "@/lib/domain";
import type { BenchInstrument } from "@/lib/schemas/sync";

// Picking the gauge (it sets the guard band and, for a dial bore gauge, the sign convention) and,
// on bore-gauge stations, dial mode: the setting size once per group, then each dial reading.
interface Props {
  gauges: BenchInstrument[];
  chosen?: BenchInstrument;
  onChoose: (id: number) => void;
  dialCapable: boolean;
  dialOn: boolean;
  onDial: (on: boolean) => void;
  onChangeSetting: () => void;
}

const pastDue = (g: BenchInstrument) => !!g.calibrationDue && g.calibrationDue < new Date().toISOString().slice(0, 10);

export const GaugeRow = memo(function GaugeRow({
  gauges,
  chosen,
  onChoose,
  dialCapable,
  dialOn,
  onDial,
  onChangeSetting,
}: Props) {
  const [open, setOpen] = useState(false);
  return (
    <div className="flex flex-col gap-2" data-testid="gauge">
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          onClick={() => setOpen(!open)}
          aria-expanded={open}
          className="min-h-16 flex-1 rounded-tool border-2 border-rule bg-panel px-4 text-left font-semibold"
        >
          {gauges.length ? "Change gauge" : "No gauge on file for this station"}
          {chosen && pastDue(chosen) && (
            <span className="block text-sm font-semibold text-fail">Calibration past due</span>
          )}
        </button>
        {dialCapable && (
          <button
            type="button"
            onClick={() => onDial(!dialOn)}
            aria-pressed={dialOn}
            className={
              "min-h-16 rounded-tool border-2 border-rule bg-panel px-4 font-semibold " +
              "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink"
            }
          >
            Dial mode {dialOn ? "on" : "off"}
          </button>
        )}
        {dialOn && (
          <button
            type="button"
            onClick={onChangeSetting}
            className="min-h-16 rounded-tool border-2 border-rule bg-panel px-4 font-semibold"
          >
            Setting size
          </button>
        )}
      </div>
      {dialOn && chosen && (
        <p className="rounded-tool border-l-4 border-steel bg-panel px-3 py-2 text-base" data-testid="dial-sign">
          On {chosen.label} ({chosen.serial}) a plus (+) reading means a{" "}
          <strong>{chosen.dialPlusMeansSmaller ? "smaller" : "larger"}</strong> bore; the diameter is worked out from
          the setting size.
        </p>
      )}
      {open && (
        <ul className="grid gap-2 sm:grid-cols-2">
          {gauges.map((g) => (
            <li key={g.id}>
              <button
                type="button"
                onClick={() => {
                  onChoose(g.id);
                  setOpen(false);
                }}
                aria-pressed={g.id === chosen?.id}
                className={
                  "min-h-16 w-full rounded-tool border-2 border-rule bg-panel px-3 text-left " +
                  "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink"
                }
              >
                <span className="block font-semibold">{g.label}</span>
                <span className="block text-sm">
                  {g.serial} · reads {g.resolution} {unitWords(g.unit)}
                  {gaugeRangeWords(g) ? ` · measures ${gaugeRangeWords(g)}` : ""}
                  {pastDue(g) ? " · calibration past due" : ""}
                </span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
});
