"use client";

import { useCallback, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { isDialBoreGauge, unitWords } from "@/lib/domain";
import { TYPE1_READINGS } from "@/lib/domain/gauge-studies";
import type { StudyReference } from "@/lib/domain/gauge-studies/types";
import { addType1Reading, changeDraft, undoLast } from "@/lib/offline/study-drafts";
import { parseReferenceReading } from "@/lib/offline/study-entry";
import type { Type1Draft } from "@/lib/offline/study-draft-shape";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { useBench } from "@/components/bench/bench-context";
import { gaugeFigure } from "./figures";
import { RecentFigures } from "./recent-figures";
import { ReferenceForm } from "./reference-form";
import { StudyPad } from "./study-pad";
import { StudyTitle } from "./study-title";
import { Type1Outcome } from "./type1-outcome";

// A repeatability run: the reference from its certificate, then 25 to 50 readings of it with the
// bench's entry (keypad or the gauge's keystrokes), each kept on the tablet the moment it is taken.
const referenceLine = (r: StudyReference, resolution: number, unit: string) =>
  `Reference ${gaugeFigure(r.value, resolution)} ${unit} · U ${r.expandedU} (k = ${r.coverageK})`;

interface Props {
  draft: Type1Draft;
  onClose: () => void;
  onSaved: (study: GaugeStudyRecord) => void;
}

export function Type1Run({ draft, onClose, onSaved }: Props) {
  const { db, actor } = useBench();
  const [reviewing, setReviewing] = useState(false);
  const [note, setNote] = useState<string>();
  const { gauge, reference, readings } = draft;
  const unit = unitWords(gauge.unit);
  const dial = isDialBoreGauge(gauge);

  const setReference = async (ref: StudyReference) => {
    const out = await changeDraft(db, actor.userId, "type1", (d: Type1Draft) => ({ ...d, reference: ref }));
    setNote("error" in out ? out.error : undefined);
  };
  const save = useCallback(
    async (text: string) => {
      if (!reference) return "Type the reference first";
      const parsed = parseReferenceReading(text, gauge, reference);
      if ("error" in parsed) return parsed.error;
      const out = await addType1Reading(db, actor.userId, parsed.value, TYPE1_READINGS.max);
      return "error" in out ? out.error : undefined;
    },
    [db, actor.userId, gauge, reference],
  );
  const undo = async () => {
    const out = await undoLast(db, actor.userId, "type1");
    setNote("error" in out ? out.error : undefined);
  };

  if (reviewing && reference)
    return (
      <Type1Outcome
        draft={{ ...draft, reference }}
        onBack={() => setReviewing(false)}
        onClose={onClose}
        onSaved={onSaved}
      />
    );
  const enough = readings.length >= TYPE1_READINGS.min;
  const full = readings.length >= TYPE1_READINGS.max;
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-4">
      <StudyTitle kind="type1" gauge={gauge} onClose={onClose} />
      {!reference ? (
        <ReferenceForm gauge={gauge} master={gauge.master} onDone={setReference} />
      ) : (
        <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <StudyPad
            label={`Reading ${Math.min(readings.length + 1, TYPE1_READINGS.max)} · ${gauge.label}`}
            hint={
              dial
                ? `Set the gauge on the reference, then type each dial reading (± for minus) and Save or Enter`
                : "Read the reference, then type the figure or let the gauge send it; Save or Enter"
            }
            unit={unit}
            gaugeLine={referenceLine(reference, gauge.resolution, unit)}
            placeholder={dial ? "±0.0000" : "0.0000"}
            onSave={save}
            disabled={full}
          />
          <div className="flex flex-col gap-3">
            <p className="text-2xl font-bold" data-testid="study-count" aria-live="polite">
              {readings.length} of {TYPE1_READINGS.min}
              <span className="text-base font-normal text-muted"> (up to {TYPE1_READINGS.max})</span>
            </p>
            <RecentFigures values={readings} resolution={gauge.resolution} label={(i) => `#${i + 1}`} />
            {note && <Notice tone="error">{note}</Notice>}
            <div className="flex flex-wrap gap-2">
              <Button tone="quiet" big onClick={() => void undo()} disabled={readings.length === 0}>
                Undo last reading
              </Button>
              <Button big onClick={() => setReviewing(true)} disabled={!enough}>
                Work out the result
              </Button>
            </div>
            {!enough && (
              <p className="text-sm text-muted">
                The result needs at least {TYPE1_READINGS.min} readings; {TYPE1_READINGS.min - readings.length} to go.
              </p>
            )}
          </div>
        </div>
      )}
    </main>
  );
}
