"use client";

import { useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { ReopenForm } from "@/components/release/reopen-form";
import { Notice } from "@/components/ui/notice";
import { canReopen, lockedJobWords } from "@/lib/domain";
import { keys, type JobDetail } from "./queries";

// A locked job on its desk page: why it is locked and what lifts the lock, in the core's words,
// and for a lead the same reopen form (and the same route and rule) as the release page.
export function JobLockPanel({ d, role }: { d: JobDetail; role: string }) {
  const qc = useQueryClient();
  const words = lockedJobWords(d.job, "its readings, limits, plan and details");
  if (!words) return null;
  const reopenable = canReopen(role, d.job);
  const refresh = () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: keys.job(d.job.id) }),
      qc.invalidateQueries({ queryKey: keys.jobs }),
    ]);
  return (
    <>
      <Notice title="Locked">
        {words}{" "}
        {d.job.hasStandingRelease && (
          <Link className="font-medium text-steel underline" href={`/release/${d.job.id}`}>
            Open the release page
          </Link>
        )}
      </Notice>
      {reopenable && <ReopenForm jobId={d.job.id} jobCode={d.job.code} onReopened={refresh} />}
    </>
  );
}
