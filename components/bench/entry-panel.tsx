"use client";

import { memo, useCallback, useRef, type RefObject } from "react";
import { gaugeKey } from "@/hooks/use-bench-entry";
import type { EntryStore } from "@/hooks/use-entry-store";
import { UNIT_WORDS, type Station } from "@/lib/domain";
import type { BenchInstrument } from "@/lib/schemas/sync";
import type { JobPrefs } from "@/lib/offline/meta";
import { EntryField } from "./entry-field";
import { GaugeRow } from "./gauge-row";
import { applyKey, Keypad, type PadKey } from "./keypad";
import { figure } from "./units";

// The entry half of the bench: the value large with its unit and the gauge in use, the glove
// keypad right under it, then the gauge and dial-mode controls.
interface Props {
  station: Station;
  store: EntryStore;
  save: () => void;
  instrument?: BenchInstrument;
  dialOn: boolean;
  needSetting: boolean;
  group?: string;
  askSetting: () => void;
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
  return station.torque
    ? "Type the torque, then Save or Enter"
    : "Type the value or let the gauge send it, then Save or Enter";
}

function gaugeLine(
  station: Station,
  g: BenchInstrument | undefined,
  dialOn: boolean,
  group: string | undefined,
  prefs: JobPrefs,
): string {
  const name = g ? `${g.label} (${g.serial})` : "no gauge picked";
  if (!dialOn || !group) return `Gauge: ${name}`;
  const setting = prefs.dialSettings[group];
  const sign = g?.dialPlusMeansSmaller ? "+ means smaller" : "+ means larger";
  const setAt = setting !== undefined ? `${figure(setting, station.unit)} ${UNIT_WORDS[station.unit]}` : "—";
  return `Dial mode · ${name} · set at ${setAt} · ${sign}`;
}

const PLACEHOLDER: Record<Station["unit"], string> = { in: "0.0000", mm: "0.000", lbf_ft: "0", nm: "0" };

export const EntryPanel = memo(function EntryPanel(p: Props) {
  const { station, store, save, askSetting, dialOn, needSetting, group, prefs, onPrefs, inputRef } = p;
  const label = needSetting ? "Setting size" : dialOn ? "Dial reading" : "Reading";
  // Callbacks that never change for the memoised keypad and gauge row.
  const focus = useCallback(() => inputRef.current?.focus(), [inputRef]);
  const onKey = useCallback(
    (k: PadKey) => {
      store.set({ draft: applyKey(store.get().draft, k), error: undefined, ask: undefined });
      focus();
    },
    [store, focus],
  );
  const saveRef = useRef(save);
  saveRef.current = save;
  const onEnter = useCallback(() => {
    saveRef.current();
    focus();
  }, [focus]);
  const key = gaugeKey(station);
  const onChoose = useCallback(
    (id: number) => onPrefs({ gauges: { ...prefs.gauges, [key]: id } }),
    [onPrefs, prefs.gauges, key],
  );
  const onDial = useCallback((on: boolean) => onPrefs({ dialMode: on }), [onPrefs]);
  const onChangeSetting = useCallback(() => {
    askSetting();
    focus();
  }, [askSetting, focus]);
  return (
    <section className="flex flex-col gap-2.5" aria-label="Entry">
      <EntryField
        ref={inputRef}
        store={store}
        onEnter={onEnter}
        unit={UNIT_WORDS[station.unit]}
        label={`${label} · ${station.label}`}
        hint={hintFor(station, dialOn, needSetting)}
        gauge={gaugeLine(station, p.instrument, dialOn, group, prefs)}
        placeholder={dialOn && !needSetting ? "±0.0000" : PLACEHOLDER[station.unit]}
        disabled={p.locked}
      />
      <Keypad onKey={onKey} onEnter={onEnter} enterLabel={needSetting ? "Set size" : "Save"} disabled={p.locked} />
      <GaugeRow
        gauges={p.gauges}
        chosen={p.instrument}
        onChoose={onChoose}
        dialCapable={p.dialCapable}
        dialOn={dialOn}
        onDial={onDial}
        onChangeSetting={onChangeSetting}
      />
    </section>
  );
});
