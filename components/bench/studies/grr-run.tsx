"use client";

import { useCallback, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { unitWords } from "@/lib/domain";
import { getMeta } from "@/lib/offline/meta";
import { addGrrValue, changeDraft, nextGrrCell, undoLast } from "@/lib/offline/study-drafts";
import { parseGaugeFigure } from "@/lib/offline/study-entry";
import type { GrrDesign, GrrDraft } from "@/lib/offline/study-draft-shape";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { useBench } from "@/components/bench/bench-context";
import { GrrGrid } from "./grr-grid";
import { GrrOutcome } from "./grr-outcome";
import { GrrSetup } from "./grr-setup";
import { StudyPad } from "./study-pad";
import { StudyTitle } from "./study-title";

// An R&R study entered part by part: who measures and how often first, then each figure into the
// cell the grid shows next (trial by trial, each person through every part), kept as it is taken.
interface Props {
  draft: GrrDraft;
  onClose: () => void;
  onSaved: (study: GaugeStudyRecord) => void;
}

export function GrrRun({ draft, onClose, onSaved }: Props) {
  const { db, actor } = useBench();
  const [reviewing, setReviewing] = useState(false);
  const [note, setNote] = useState<string>();
  const [people] = useDexieQuery(
    db,
    ["meta"],
    async () => getMeta<Record<string, string>>(db, "people"),
    [],
    undefined,
  );
  const { gauge, design, measurements } = draft;
  const next = nextGrrCell(draft);

  const setDesign = async (d: GrrDesign) => {
    const out = await changeDraft(db, actor.userId, "grr", (g: GrrDraft) => ({ ...g, design: d, measurements: [] }));
    setNote("error" in out ? out.error : undefined);
  };
  const save = useCallback(
    async (text: string) => {
      const parsed = parseGaugeFigure(text, gauge);
      if ("error" in parsed) return parsed.error;
      const out = await addGrrValue(db, actor.userId, parsed.value);
      return "error" in out ? out.error : undefined;
    },
    [db, actor.userId, gauge],
  );
  const undo = async () => {
    const out = await undoLast(db, actor.userId, "grr");
    setNote("error" in out ? out.error : undefined);
  };

  if (reviewing && design && !next)
    return (
      <GrrOutcome draft={{ ...draft, design }} onBack={() => setReviewing(false)} onClose={onClose} onSaved={onSaved} />
    );
  const total = design ? design.appraisers.length * design.parts * design.trials : 0;
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-4">
      <StudyTitle kind="grr" gauge={gauge} onClose={onClose} />
      {!design ? (
        <GrrSetup gauge={gauge} me={actor.name} people={Object.values(people ?? {})} onDone={setDesign} />
      ) : (
        <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <StudyPad
            label={
              next
                ? `Trial ${next.trial} · ${design.appraisers[next.appraiser - 1]} · part ${next.part}`
                : "Every figure is in"
            }
            hint={
              next
                ? `${design.appraisers[next.appraiser - 1]} measures part ${next.part}; ` +
                  "type the figure or let the gauge send it"
                : "Work out the result, or undo the last figure to change it"
            }
            unit={unitWords(gauge.unit)}
            gaugeLine={`${gauge.label} (${gauge.serial})`}
            placeholder="0.0000"
            onSave={save}
            disabled={!next}
          />
          <div className="flex flex-col gap-3">
            <p className="text-2xl font-bold" data-testid="study-count" aria-live="polite">
              {measurements.length} of {total}
            </p>
            <GrrGrid draft={draft} design={design} />
            {note && <Notice tone="error">{note}</Notice>}
            <div className="flex flex-wrap gap-2">
              <Button tone="quiet" big onClick={() => void undo()} disabled={measurements.length === 0}>
                Undo last figure
              </Button>
              <Button big onClick={() => setReviewing(true)} disabled={!!next}>
                Work out the result
              </Button>
            </div>
          </div>
        </div>
      )}
    </main>
  );
}
