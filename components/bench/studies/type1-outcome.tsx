"use client";

import { useMemo } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { RunChart } from "@/components/gauge-studies/run-chart";
import { StudyHistogram } from "@/components/gauge-studies/histogram";
import { unitWords } from "@/lib/domain";
import { DEFAULT_STUDY_THRESHOLDS, type1Study } from "@/lib/domain/gauge-studies";
import type { StudyReference } from "@/lib/domain/gauge-studies/types";
import type { Type1Draft } from "@/lib/offline/study-draft-shape";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { SavePanel } from "./save-panel";
import { StudyTitle } from "./study-title";
import { Type1Figures } from "./type1-figures";
import { useStudyPreview } from "./use-study-preview";

// The result of a repeatability run. On the tablet at once (the core's spread, bias and t-test,
// which need no tolerance); the server's answer adds Cg and Cgk for each tolerance the gauge judges
// on the shop's jobs and what saving would change, and only the server saves it.
// Fits the half of a 1024 px landscape tablet beside the figures (the charts draw at a fixed width).
const CHART_WIDTH = 440;

interface Props {
  draft: Type1Draft & { reference: StudyReference };
  onBack: () => void;
  onClose: () => void;
  onSaved: (study: GaugeStudyRecord) => void;
}

export function Type1Outcome({ draft, onBack, onClose, onSaved }: Props) {
  const { gauge, reference, readings } = draft;
  const unit = unitWords(gauge.unit);
  const local = useMemo(
    () =>
      type1Study({
        readings,
        reference,
        resolution: gauge.resolution,
        characteristics: [],
        thresholds: DEFAULT_STUDY_THRESHOLDS,
      }),
    [readings, reference, gauge.resolution],
  );
  const { state, ask, save, saveError } = useStudyPreview(draft, onSaved);
  const preview = state.kind === "preview" || state.kind === "saving" ? state.preview : undefined;
  const result = preview?.study.type1 ?? local;
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-4">
      <StudyTitle kind="type1" gauge={gauge} onClose={onClose} />
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="flex flex-col gap-3">
          <Type1Figures result={result} resolution={gauge.resolution} unit={unit} />
          {state.kind === "asking" && <p className="text-muted">Asking the server for Cg and Cgk…</p>}
          {state.kind === "failed" && (
            <Notice tone="error" title="Cg and Cgk need the server">
              <p>{state.words}</p>
              <Button tone="quiet" className="mt-2" onClick={ask}>
                Ask again
              </Button>
            </Notice>
          )}
          {preview && preview.study.type1?.perCharacteristic.length === 0 && (
            <Notice>
              No open job or spec uses this gauge yet, so there is no tolerance to judge Cg and Cgk against.
            </Notice>
          )}
          {preview && (
            <SavePanel
              preview={preview}
              saving={state.kind === "saving"}
              error={saveError}
              onSave={() => void save(preview)}
            />
          )}
          <Button tone="quiet" big onClick={onBack} className="self-start">
            Back to the readings
          </Button>
        </div>
        <div className="flex flex-col gap-3">
          <RunChart
            readings={readings}
            reference={reference.value}
            unit={gauge.unit}
            characteristics={result.perCharacteristic}
            mean={result.mean}
            width={CHART_WIDTH}
          />
          <StudyHistogram
            readings={readings}
            reference={reference.value}
            resolution={gauge.resolution}
            unit={gauge.unit}
            mean={result.mean}
            sd={result.sd}
            width={CHART_WIDTH}
          />
        </div>
      </div>
    </main>
  );
}
