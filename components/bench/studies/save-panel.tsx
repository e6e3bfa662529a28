"use client";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { StudyPreview } from "@/lib/schemas/gauge-studies";

// What saving the study does before it is saved: the readings of open jobs taken with this gauge
// are judged again with its new uncertainty, counted by the server running the very save.
interface Props {
  preview: StudyPreview;
  saving: boolean;
  error?: string;
  onSave: () => void;
}

export function SavePanel({ preview, saving, error, onSave }: Props) {
  const { consequences, jobs, wide, words } = preview;
  return (
    <section className="flex flex-col gap-2 rounded-tool border-2 border-steel bg-panel p-3" aria-label="Saving">
      <p className="text-lg font-semibold" data-testid="study-consequences">
        Saving this study {words} on open jobs measured with this gauge.
      </p>
      {jobs.length > 0 && (
        <ul className="flex flex-col gap-0.5 text-base" aria-label="Per job">
          {jobs.map((j) => (
            <li key={j.jobId}>
              <span className="font-mono font-semibold">{j.code}</span>: {j.words}
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-muted">
        From then on this gauge&apos;s uncertainty counts the study&apos;s repeatability, so readings near a limit may
        change verdict.
      </p>
      {wide && (
        <Notice tone="caution" title="A wide change">
          It opens {consequences.flagsOpened} flags the lead will see on the desk. Save only if the study was run as it
          should be.
        </Notice>
      )}
      {error && <Notice tone="error">{error}</Notice>}
      <Button big onClick={onSave} disabled={saving} className="self-start">
        {saving ? "Saving…" : "Save the study"}
      </Button>
    </section>
  );
}
