"use client";

import { useState } from "react";
import type { BenchInstrument } from "@/lib/schemas/sync";
import { figure, UNIT_WORDS } from "./units";
import type { MeasureUnit } from "@/lib/domain";

// The gauge in use (it sets the guard band and, for a dial bore gauge, the sign convention) and,
// for bore-gauge stations, dial mode: the setting size once per group, then each dial reading.
interface Props {
  gauges: BenchInstrument[];
  chosen?: BenchInstrument;
  onChoose: (id: number) => void;
  dialCapable: boolean;
  dialOn: boolean;
  onDial: (on: boolean) => void;
  setting?: number;
  unit: MeasureUnit;
  onChangeSetting: () => void;
}

const due = (g: BenchInstrument) => (g.calibrationDue && g.calibrationDue < new Date().toISOString().slice(0, 10) ? " · calibration past due" : "");

export function GaugeRow({ gauges, chosen, onChoose, dialCapable, dialOn, onDial, setting, unit, onChangeSetting }: Props) {
  const [open, setOpen] = useState(false);
  return (
    <div className="flex flex-col gap-2" data-testid="gauge">
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" onClick={() => setOpen(!open)} aria-expanded={open} className="min-h-16 flex-1 rounded-tool border-2 border-rule bg-panel px-4 text-left">
          <span className="block text-sm text-muted">Gauge</span>
          <span className="block font-semibold">{chosen ? `${chosen.label} (${chosen.serial})${due(chosen)}` : "No gauge on file for this station"}</span>
        </button>
        {dialCapable && (
          <button type="button" onClick={() => onDial(!dialOn)} aria-pressed={dialOn} className="min-h-16 rounded-tool border-2 border-rule px-4 font-semibold aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink">
            Dial mode {dialOn ? "on" : "off"}
          </button>
        )}
      </div>
      {open && (
        <ul className="grid gap-2 sm:grid-cols-2">
          {gauges.map((g) => (
            <li key={g.id}>
              <button type="button" onClick={() => { onChoose(g.id); setOpen(false); }} aria-pressed={g.id === chosen?.id} className="min-h-16 w-full rounded-tool border-2 border-rule bg-panel px-3 text-left aria-pressed:border-steel">
                <span className="block font-semibold">{g.label}</span>
                <span className="block text-sm text-muted">{g.serial} · reads {g.resolution} {g.unit}{due(g)}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {dialOn && chosen && (
        <div className="flex flex-wrap items-center gap-3 rounded-tool border-2 border-steel bg-panel px-3 py-2" data-testid="dial">
          <span className="font-semibold">
            Setting size: {setting !== undefined ? `${figure(setting, unit)} ${UNIT_WORDS[unit]}` : "not set yet"}
          </span>
          <span className="text-base" data-testid="dial-sign">
            On this gauge plus (+) means a <strong>{chosen.dialPlusMeansSmaller ? "smaller" : "larger"}</strong> bore
          </span>
          <button type="button" onClick={onChangeSetting} className="min-h-16 rounded-tool border-2 border-rule px-4 font-semibold">Change setting</button>
        </div>
      )}
    </div>
  );
}
