"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import type { GaugeStudyRecord, StudyPreview, StudySaved } from "@/lib/schemas/gauge-studies";
import { failureWords, postStudy, studyBody } from "@/lib/offline/study-api";
import { discardDraft } from "@/lib/offline/study-drafts";
import type { StudyDraft } from "@/lib/offline/study-draft-shape";
import { useBench } from "@/components/bench/bench-context";

type State =
  | { kind: "asking" }
  | { kind: "preview"; preview: StudyPreview }
  | { kind: "failed"; words: string }
  | { kind: "saving"; preview: StudyPreview };

/**
 * The server's own result of a finished run and what saving it would change (readings of open
 * jobs taken with the gauge), then the save itself; only a save the server confirmed clears the run.
 */
export function useStudyPreview(draft: StudyDraft, onSaved: (study: GaugeStudyRecord) => void) {
  const { db, actor } = useBench();
  const [state, setState] = useState<State>({ kind: "asking" });
  const [saveError, setSaveError] = useState<string>();
  // Asked again only when what was measured changed, not each time the kept copy is read again.
  const key = `${draft.gauge.id} ${JSON.stringify(studyBody(draft))}`;
  const latest = useRef(draft);
  latest.current = draft;
  const ask = useCallback(() => {
    let stale = false;
    setState({ kind: "asking" });
    postStudy<StudyPreview>(latest.current.gauge.id, latest.current, true).then(
      (preview) => !stale && setState({ kind: "preview", preview }),
      (err: unknown) => !stale && setState({ kind: "failed", words: failureWords(err, "work out the study") }),
    );
    return () => void (stale = true);
  }, []);
  useEffect(ask, [ask, key]);

  const save = async (preview: StudyPreview) => {
    setSaveError(undefined);
    setState({ kind: "saving", preview });
    try {
      const { study } = await postStudy<StudySaved>(draft.gauge.id, draft, false, {
        confirmedFlagsOpened: preview.consequences.flagsOpened,
      });
      // The screen learns first (the run's screen closes once its kept copy is gone).
      onSaved(study);
      await discardDraft(db, actor.userId, draft.kind);
    } catch (err) {
      setSaveError(failureWords(err, "save the study"));
      setState({ kind: "preview", preview });
    }
  };
  return { state, ask, save, saveError };
}
