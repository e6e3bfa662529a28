import { Button } from "@/components/ui/button";
import { instrumentKindWords } from "@/lib/domain";
import type { DraftGauge, StudyKind } from "@/lib/offline/study-draft-shape";
import { STUDY_KIND_WORDS } from "./words";

/** The run's heading: what study, on which gauge, and the way back (the run stays kept). */
export function StudyTitle({ kind, gauge, onClose }: { kind: StudyKind; gauge: DraftGauge; onClose: () => void }) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <div className="min-w-0 flex-1">
        <h1 className="text-2xl font-bold">{STUDY_KIND_WORDS[kind]}</h1>
        <p className="text-muted">
          {gauge.label} · {instrumentKindWords(gauge.kind)} · {gauge.serial} · reads {gauge.resolution} {gauge.unit}
        </p>
      </div>
      <Button tone="quiet" onClick={onClose}>
        All studies (this one stays kept)
      </Button>
    </div>
  );
}
