"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { api } from "@/lib/client/api";
import type { ChangePreview, JobValues } from "@/lib/schemas/job";
import { applyFieldErrors } from "./fields";
import type { JobDetail } from "./queries";

// An edit of a job is first run by the server and rolled back (POST /api/jobs/:id/preview): when
// it changes a finished size or any verdict or flag, the lead reads what it will do and confirms
// before it is saved; an edit that changes none of them saves at once.

/** Whether the edit states other finished sizes than the job has stored. */
function sizesChanged(job: JobDetail, v: JobValues): boolean {
  const stored = job.job.finishedSizes;
  const given = v.finishedSizes;
  if (!given) return false;
  return (["bore", "mainJournal", "rodJournal"] as const).some((k) => (given[k] ?? null) !== (stored[k] ?? null));
}

export function useEditPreview(
  job: JobDetail | undefined,
  save: (v: JobValues) => void,
  setError: Parameters<typeof applyFieldErrors>[1],
) {
  const [confirming, setConfirming] = useState<{ values: JobValues; preview: ChangePreview } | null>(null);
  const preview = useMutation({
    mutationFn: (v: JobValues) => api<ChangePreview>(`/api/jobs/${job!.job.id}/preview`, { method: "POST", json: v }),
    onSuccess: (p, v) => {
      const c = p.consequences;
      const quiet = !c.flagsOpened && !c.flagsClosed && !c.verdictsChanged && !c.requiredStations;
      if (quiet && !sizesChanged(job!, v)) save(v);
      else setConfirming({ values: v, preview: p });
    },
    onError: (err) => applyFieldErrors(err, setError),
  });
  return { confirming, setConfirming, preview };
}
