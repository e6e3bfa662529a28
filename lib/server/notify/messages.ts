import "server-only";
import { characteristicWords, stationWords, VERDICT_WORDS } from "@/lib/domain";
import type { ReleaseChecklist } from "@/lib/schemas/release";
import { env } from "@/lib/server/core/env";
import type { DigestFlag, OpenJob } from "@/lib/server/notify/repo";
import { limitsText, plural, when, withUnit } from "@/lib/server/record/format";

// The words of the flag digest (to leads) and the "ready for release" note (to inspectors).
const MAX_LISTED = 40;
const REASON = {
  out_of_spec: "outside its limits",
  marginal: "within the gauge's uncertainty of a limit",
  gauge_past_due: "gauge past calibration due",
  gauge_study_failed: "gauge failed its study for this tolerance",
  gauge_study_due: "gauge study past due",
} as Record<string, string>;
const STATE = {
  open: "waiting for a decision",
  disposed: "decided since",
  closed: "closed since by a newer in-spec reading",
} as Record<string, string>;

const appUrl = (path: string) => `${env().APP_URL.replace(/\/$/, "")}${path}`;

function flagLine(f: DigestFlag): string {
  const verdict = (VERDICT_WORDS as Record<string, string>)[f.verdict] ?? f.verdict;
  return (
    `- ${f.jobCode} · ${stationWords(f.stationId)}: ` +
    `${characteristicWords(f.characteristic).toLowerCase()} ${withUnit(f.value, f.unit)} ` +
    `(limits ${limitsText(f.limitMin, f.limitMax, f.unit)}), ${verdict.toUpperCase()}, ` +
    `${REASON[f.reason] ?? f.reason}; ${STATE[f.state] ?? f.state}.`
  );
}

export function digestMessage(
  shop: string,
  flags: DigestFlag[],
  since: Date | null,
): { subject: string; text: string } {
  const jobs = [...new Set(flags.map((f) => f.jobCode))];
  const listed = flags.slice(0, MAX_LISTED).map(flagLine);
  const firstJobs = `${jobs.slice(0, 4).join(", ")}${jobs.length > 4 ? ", …" : ""}`;
  const sinceWhen = since ? `since the last digest (${when(since)})` : "in the last day";
  if (flags.length > MAX_LISTED) listed.push(`- and ${flags.length - MAX_LISTED} more on the flag queue.`);
  const text = [
    `${plural(flags.length, "new flag")} at ${shop} ${sinceWhen}, ` +
      `on ${plural(jobs.length, "job")}: ${jobs.join(", ")}.`,
    listed.join("\n"),
    "Decide each one (measure again, machine again, or accept with a reason) on the flag queue:\n" +
      appUrl("/desk/flags"),
  ].join("\n\n");
  return {
    subject: `${plural(flags.length, "new flag")} to review: ${firstJobs}`,
    text,
  };
}

export function readyMessage(job: OpenJob, checklist: ReleaseChecklist): { subject: string; text: string } {
  const done = checklist.checks.map((c) => `- ${c.title}: ${c.summary}.`).join("\n");
  const text = [
    `Job ${job.code} (${job.title}) is ready for release: its checklist is complete.`,
    done,
    `Review it and sign it off:\n${appUrl(`/release/${job.id}`)}`,
  ].join("\n\n");
  return { subject: `Ready for release: ${job.code}, ${job.title}`, text };
}
