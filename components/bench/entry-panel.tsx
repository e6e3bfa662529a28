"use client";

import { FastenerCaution } from "@/components/ui/notice";
import type { Station } from "@/lib/domain";
import type { BenchInstrument } from "@/lib/schemas/sync";
import type { JobPrefs } from "@/lib/offline/meta";
import { EntryField } from "./entry-field";
import { GaugeRow } from "./gauge-row";
import { applyKey, Keypad } from "./keypad";
import { LubricantPicker } from "./lubricant-picker";
import { UNIT_WORDS } from "./units";
import type { RefObject } from "react";

// The right-hand half of the bench: the value large with its unit and gauge, the glove keypad,
// and what a station needs besides a number (lubricant for torque, dial setting for bores).
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
  if (needSetting) return "Type the size the gauge was zeroed on, then Save; it is kept for this group of stations";
  if (dialOn) return "Type the dial's reading (with − if minus), then Save or Enter";
  return station.torque ? "Type the torque, then Save or Enter" : "Type the value, or let the gauge send it, then Save or Enter";
}

export function EntryPanel({ station, entry, gauges, prefs, onPrefs, inputRef, locked, dialCapable }: Props) {
  const label = entry.needSetting ? "Setting size" : entry.dialOn ? "Dial reading" : "Reading";
  const focus = () => inputRef.current?.focus();
  return (
    <section className="flex flex-col gap-3" aria-label="Entry">
      <EntryField
        ref={inputRef}
        value={entry.draft}
        onChange={entry.setDraft}
        onEnter={entry.save}
        unit={UNIT_WORDS[station.unit]}
        label={`${label} · ${station.label}`}
        hint={hintFor(station, entry.dialOn, entry.needSetting)}
        error={entry.error}
        disabled={locked}
      />
      <GaugeRow
        gauges={gauges}
        chosen={entry.instrument}
        onChoose={(id) => onPrefs({ gauges: { ...prefs.gauges, [station.gaugeKind ?? station.characteristic]: id } })}
        dialCapable={dialCapable}
        dialOn={entry.dialOn}
        onDial={(on) => onPrefs({ dialMode: on })}
        setting={entry.group ? prefs.dialSettings[entry.group] : undefined}
        unit={station.unit}
        onChangeSetting={() => {
          entry.askSetting();
          focus();
        }}
      />
      {station.torque && <LubricantPicker value={prefs.lubricant} onPick={(l) => onPrefs({ lubricant: l })} />}
      {station.section === "bolt" && <FastenerCaution />}
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
    </section>
  );
}
