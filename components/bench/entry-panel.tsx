"use client";

import type { RefObject } from "react";
import type { Station } from "@/lib/domain";
import type { BenchInstrument } from "@/lib/schemas/sync";
import type { JobPrefs } from "@/lib/offline/meta";
import { EntryField } from "./entry-field";
import { GaugeRow } from "./gauge-row";
import { applyKey, Keypad } from "./keypad";
import { figure, UNIT_WORDS } from "./units";

// The entry half of the bench: the value large with its unit and the gauge in use, the glove
// keypad right under it, then the gauge and dial-mode controls.
interface Props {
  station: Station;
  entry: {
    draft: string;
    setDraft: (v: string) => void;
    error?: string;
    save: () => void;
    instrument?: BenchInstrument;
    dialOn: boolean;
    needSetting: boolean;
    group?: string;
    askSetting: () => void;
  };
  gauges: BenchInstrument[];
  prefs: JobPrefs;
  onPrefs: (patch: Partial<JobPrefs>) => void;
  inputRef: RefObject<HTMLInputElement | null>;
  locked: boolean;
  dialCapable: boolean;
}

function hintFor(station: Station, dialOn: boolean, needSetting: boolean): string {
  if (needSetting) return "Type the size the gauge was zeroed on, then Set size; it is kept for this group of stations";
  if (dialOn) return "Type the dial's reading (± for minus), then Save or Enter";
  return station.torque ? "Type the torque, then Save or Enter" : "Type the value or let the gauge send it, then Save or Enter";
}

function gaugeLine(station: Station, entry: Props["entry"], prefs: JobPrefs): string {
  const g = entry.instrument;
  const name = g ? `${g.label} (${g.serial})` : "no gauge picked";
  if (!entry.dialOn || !entry.group) return `Gauge: ${name}`;
  const setting = prefs.dialSettings[entry.group];
  const sign = g?.dialPlusMeansSmaller ? "+ means smaller" : "+ means larger";
  return `Dial mode · ${name} · set at ${setting !== undefined ? `${figure(setting, station.unit)} ${UNIT_WORDS[station.unit]}` : "—"} · ${sign}`;
}

const PLACEHOLDER: Record<Station["unit"], string> = { in: "0.0000", mm: "0.000", lbf_ft: "0", nm: "0" };

export function EntryPanel({ station, entry, gauges, prefs, onPrefs, inputRef, locked, dialCapable }: Props) {
  const label = entry.needSetting ? "Setting size" : entry.dialOn ? "Dial reading" : "Reading";
  const focus = () => inputRef.current?.focus();
  return (
    <section className="flex flex-col gap-2.5" aria-label="Entry">
      <EntryField
        ref={inputRef}
        value={entry.draft}
        onChange={entry.setDraft}
        onEnter={entry.save}
        unit={UNIT_WORDS[station.unit]}
        label={`${label} · ${station.label}`}
        hint={hintFor(station, entry.dialOn, entry.needSetting)}
        gauge={gaugeLine(station, entry, prefs)}
        placeholder={entry.dialOn && !entry.needSetting ? "±0.0000" : PLACEHOLDER[station.unit]}
        error={entry.error}
        disabled={locked}
      />
      <Keypad
        onKey={(k) => {
          entry.setDraft(applyKey(entry.draft, k));
          focus();
        }}
        onEnter={() => {
          entry.save();
          focus();
        }}
        enterLabel={entry.needSetting ? "Set size" : "Save"}
        disabled={locked}
      />
      <GaugeRow
        gauges={gauges}
        chosen={entry.instrument}
        onChoose={(id) => onPrefs({ gauges: { ...prefs.gauges, [station.gaugeKind ?? station.characteristic]: id } })}
        dialCapable={dialCapable}
        dialOn={entry.dialOn}
        onDial={(on) => onPrefs({ dialMode: on })}
        onChangeSetting={() => {
          entry.askSetting();
          focus();
        }}
      />
    </section>
  );
}
