import { Notice } from "@/components/ui/notice";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { StudyPass } from "./study-pass";
import { STUDY_KIND_WORDS } from "./words";

/** The server's word that a study is kept: what it found, and when the gauge is due again. */
export function SavedNotice({ study }: { study: GaugeStudyRecord }) {
  return (
    <div data-testid="study-saved">
      <Notice title={`${STUDY_KIND_WORDS[study.kind]} saved`}>
        <p className="flex flex-wrap items-center gap-2">
          <StudyPass pass={study.passed} what="for the tolerances it judges" />
          <span>
            Taken {study.performedOn}; due again {study.dueOn}. Readings of open jobs taken with this gauge now count
            its repeatability.
          </span>
        </p>
      </Notice>
    </div>
  );
}
