"use client";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { AnovaTable } from "@/components/gauge-studies/anova-table";
import type { GrrDesign, GrrDraft } from "@/lib/offline/study-draft-shape";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { SavePanel } from "./save-panel";
import { StudyPass } from "./study-pass";
import { StudyTitle } from "./study-title";
import { useStudyPreview } from "./use-study-preview";

// The result of an R&R study, worked out by the server with the core (the ANOVA needs every figure
// and the shop's thresholds), with what saving it would change; the figures stay on the tablet.
interface Props {
  draft: GrrDraft & { design: GrrDesign };
  onBack: () => void;
  onClose: () => void;
  onSaved: (study: GaugeStudyRecord) => void;
}

export function GrrOutcome({ draft, onBack, onClose, onSaved }: Props) {
  const { state, ask, save, saveError } = useStudyPreview(draft, onSaved);
  const preview = state.kind === "preview" || state.kind === "saving" ? state.preview : undefined;
  const result = preview?.study.grr;
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-4 px-4 py-4">
      <StudyTitle kind="grr" gauge={draft.gauge} onClose={onClose} />
      {state.kind === "asking" && <p className="text-muted">Working out the study on the server…</p>}
      {state.kind === "failed" && (
        <Notice tone="error" title="The R&R result needs the server">
          <p>{state.words}</p>
          <Button tone="quiet" className="mt-2" onClick={ask}>
            Ask again
          </Button>
        </Notice>
      )}
      {preview && result && (
        <>
          <StudyPass
            pass={preview.study.passed}
            what={`against the shop's largest %GRR (${preview.study.thresholds.maxGrrPct} %)`}
          />
          <AnovaTable result={result} unit={draft.gauge.unit} />
          <SavePanel
            preview={preview}
            saving={state.kind === "saving"}
            error={saveError}
            onSave={() => void save(preview)}
          />
        </>
      )}
      <Button tone="quiet" big onClick={onBack} className="self-start">
        Back to the figures
      </Button>
    </main>
  );
}
