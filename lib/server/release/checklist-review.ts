import "server-only";
import { characteristicWords, stationWords, verdictInText } from "@/lib/domain";
import { buildPlanSchema } from "@/lib/schemas/build-plan";
import type { ChecklistCheck, ChecklistItem, ChecklistLink } from "@/lib/schemas/release";
import { benchLink, derivedInputs, plural } from "@/lib/server/release/checklist-rules";
import type { FlagRow, JobRecord } from "@/lib/server/release/repo";

// The flags and build-plan checks of the release checklist (the gauges check: checklist-gauges.ts). Pure, like the rules file.

const REASON_WORDS = {
  out_of_spec: verdictInText("out_of_spec"),
  marginal: "marginal (inside the limits by less than the gauge's uncertainty)",
  gauge_past_due: "taken with a gauge past its calibration due date",
  gauge_study_failed: "taken with a gauge whose latest study fails for this tolerance",
  gauge_study_due: "taken with a gauge whose study was past its due date",
} as const;

const flagLink = (id: number): ChecklistLink => ({ label: `Open flag #${id}`, href: `/desk/flags/${id}` });

/** The stations a flag sends back to the bench: a derived value's inputs, else its own station. */
function flagStations(record: JobRecord, f: FlagRow): string[] {
  if (f.derivedKey) return derivedInputs(record).get(f.derivedKey)?.inputs ?? [f.stationId];
  return [f.stationId];
}

function flagItem(record: JobRecord, f: FlagRow): ChecklistItem | null {
  const what = `${characteristicWords(f.characteristic)} at ${stationWords(f.stationId)}`;
  const reason = REASON_WORDS[f.reason] ?? (f.verdict ? verdictInText(f.verdict) : f.reason);
  if (f.state === "closed" || (f.state === "disposed" && f.disposition === "accept")) return null;
  if (f.state === "disposed" && (f.disposition === "measure_again" || f.disposition === "machine_again")) {
    const sent =
      f.disposition === "machine_again"
        ? `to be machined again${f.operation ? ` (${f.operation})` : ""} and measured`
        : "to be measured again";
    const stations = flagStations(record, f);
    return {
      check: "flags",
      key: `flags:${f.id}`,
      text:
        `Flag #${f.id}, ${what} (${reason}): the lead sent it back ${sent}; ` +
        "it still blocks release until a new in-spec reading closes it",
      links: [flagLink(f.id), ...stations.slice(0, 2).map((s) => benchLink(record.job.id, s))],
    };
  }
  return {
    check: "flags",
    key: `flags:${f.id}`,
    text:
      `Flag #${f.id}, ${what} (${reason}): open, waiting for the lead's decision ` +
      "(measure again, machine again, or accept with a reason)",
    links: [flagLink(f.id)],
  };
}

export function flagsCheck(record: JobRecord): ChecklistCheck {
  const title = "No flag is open: each is in spec again or has a decision";
  const items = record.flags.map((f) => flagItem(record, f)).filter((i): i is ChecklistItem => i !== null);
  const closed = record.flags.filter((f) => f.state === "closed").length;
  const accepted = record.flags.filter((f) => f.state === "disposed" && f.disposition === "accept").length;
  const settled = [
    closed ? `${plural(closed, "flag")} closed by an in-spec reading` : "",
    accepted ? `${accepted} accepted with a reason` : "",
  ].filter(Boolean);
  const summary =
    record.flags.length === 0
      ? "No flags on this job"
      : items.length === 0
        ? `${settled.join(", ")}; none open`
        : `${plural(items.length, "flag")} still blocking; ${closed} closed, ${accepted} accepted`;
  return { id: "flags", title, ok: items.length === 0, summary, items };
}

/** The plan fields a release needs, in words. Lash and notes are optional. */
export const REQUIRED_PLAN_FIELDS = {
  bore: "bore",
  stroke: "stroke",
  rodLength: "rod length",
  compressionHeight: "piston compression height",
  pistonTop: "piston top (flat, dish or dome)",
  chamberCc: "chamber volume",
  gasketBore: "gasket bore",
  gasketThickness: "gasket thickness",
  deckHeight: "deck height",
  intakeLobeLift: "intake lobe lift",
  exhaustLobeLift: "exhaust lobe lift",
  rockerRatio: "rocker ratio",
} as const;

export function planCheck(record: JobRecord): ChecklistCheck {
  const title = "The build plan is filled in";
  const link = { label: "Open the build plan", href: `/desk/jobs/${record.job.id}/plan` };
  const item = (key: string, text: string): ChecklistItem => ({
    check: "plan",
    key: `plan:${key}`,
    text,
    links: [link],
  });
  const plan = record.job.buildPlan;
  if (!plan)
    return {
      id: "plan",
      title,
      ok: false,
      summary: "No build plan yet",
      items: [item("none", "No build plan yet: the lead enters the combination on the plan page")],
    };
  const parsed = buildPlanSchema.safeParse(plan);
  if (!parsed.success) {
    const first = parsed.error.issues
      .slice(0, 3)
      .map((i) => i.message)
      .join("; ");
    return {
      id: "plan",
      title,
      ok: false,
      summary: "The build plan has errors",
      items: [item("invalid", `The saved build plan has errors: ${first}`)],
    };
  }
  const p = parsed.data as Record<string, unknown>;
  const items = Object.entries(REQUIRED_PLAN_FIELDS)
    .filter(([k]) => p[k] === null || p[k] === undefined)
    .map(([k, words]) => item(k, `The build plan has no ${words} yet`));
  if (p.pistonTop !== "flat" && (p.pistonVolumeCc === null || p.pistonVolumeCc === undefined)) {
    items.push(item("pistonVolumeCc", `The build plan has no ${String(p.pistonTop)} volume yet`));
  }
  const total = Object.keys(REQUIRED_PLAN_FIELDS).length;
  const summary =
    items.length === 0
      ? "The build plan is filled in"
      : `${plural(items.length, "figure")} of the build plan still empty (of ${total} needed)`;
  return { id: "plan", title, ok: items.length === 0, summary, items };
}
