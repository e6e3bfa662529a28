"use client";

import { useContext, type ContextType } from "react";
import {
  JOB_SIZE_OF,
  JOB_SIZE_WORDS,
  SIZE_OF,
  resolveLimit,
  unitWords,
  type CharacteristicId,
  type SpecLimit,
} from "@/lib/domain";
import { compactLimit, type LimitInput, type LimitValues } from "@/lib/schemas/spec";
import { JobSizesContext } from "./job-sizes-context";

// What the limit comes to, worked out by the core (resolveLimit) as the lead types, so a
// slip such as a swapped tolerance shows before it is saved. A minimum and maximum on a clearance
// reads as the clearance window a shop talks about; limits that follow the job say which size.

/** Gaps between two parts, whose limits a shop calls a clearance window. */
const CLEARANCES = new Set<CharacteristicId>([
  "main_oil_clearance",
  "rod_oil_clearance",
  "piston_to_wall",
  "rod_side_clearance",
  "crank_end_play",
  "ring_end_gap",
]);

const num = (x: unknown) => (typeof x === "number" && Number.isFinite(x) ? x : null);

function perInchWords(l: LimitInput): string | null {
  const [lo, hi] = [num(l.perInchMin), num(l.perInchMax)];
  if (lo === null && hi === null) return null;
  const size = l.characteristic ? SIZE_OF[l.characteristic] : undefined;
  const of = size ? `of the job's ${JOB_SIZE_WORDS[size]}` : "of diameter";
  const per = `${unitWords(l.unit)} per ${l.unit === "mm" ? "mm" : "inch"} ${of}`;
  const head = CLEARANCES.has(l.characteristic) ? "Clearance window" : "Scales with the diameter";
  if (lo === null) return `${head}: up to ${hi} ${per}`;
  if (hi === null) return `${head}: ${lo} ${per} or more`;
  return `${head}: ${lo} to ${hi} ${per}`;
}

function jobSizeWords(l: LimitInput): string | null {
  const size = l.characteristic ? JOB_SIZE_OF[l.characteristic] : undefined;
  const [plus, minus] = [num(l.tolPlus), num(l.tolMinus)];
  if (!size || plus === null || minus === null || plus < 0 || minus < 0) return null;
  const u = unitWords(l.unit);
  return `Accepts each job's ${JOB_SIZE_WORDS[size]} −${minus} / +${plus} ${u}`;
}

function words(l: LimitInput): string | null {
  if (l.limitType === "per_inch") return perInchWords(l);
  if (l.limitType === "job_size_tol") return jobSizeWords(l);
  if (l.limitType === "iso286" && (l.nominal === null || l.nominal === undefined)) {
    return l.isoClass ? `ISO 286 ${l.isoClass} on the job's finished size (else the engine's nominal size)` : null;
  }
  const clean = compactLimit(l as LimitValues) as unknown as SpecLimit;
  const r = resolveLimit(clean);
  const u = unitWords(r.unit);
  const nominal = r.nominal !== undefined ? ` (nominal ${r.nominal})` : "";
  const window = CLEARANCES.has(l.characteristic) ? "Clearance window: " : "Accepts ";
  if (r.min === undefined) return `Accepts up to ${r.max} ${u}`;
  if (r.max === undefined) return `Accepts ${r.min} ${u} or more`;
  return `${window}${r.min} to ${r.max} ${u}${nominal}`;
}

/** On a job's own limits page: what a limit that follows the job comes to with this job's size. */
function onThisJob(l: LimitInput, job: ContextType<typeof JobSizesContext>): string | null {
  const follows =
    l.limitType === "job_size_tol" ||
    l.limitType === "per_inch" ||
    (l.limitType === "iso286" && (l.nominal === null || l.nominal === undefined));
  const size = l.characteristic ? SIZE_OF[l.characteristic] : undefined;
  const value = size && job ? job.sizes[size] : null;
  if (!follows || !size || !job || value === null) return null;
  const stated = { value, unit: job.unit };
  const r = resolveLimit(compactLimit(l as LimitValues) as unknown as SpecLimit, { jobSize: stated, diameter: stated });
  const u = unitWords(r.unit);
  const range =
    r.min === undefined
      ? `up to ${r.max} ${u}`
      : r.max === undefined
        ? `${r.min} ${u} or more`
        : `${r.min} to ${r.max} ${u}`;
  return `On this job (${JOB_SIZE_WORDS[size]} ${value} ${unitWords(job.unit)}): ${range}`;
}

export function SpecLimitPreview({ limit }: { limit: LimitInput }) {
  const job = useContext(JobSizesContext);
  let text: string | null;
  let here: string | null = null;
  try {
    text = limit.characteristic && limit.limitType ? words(limit) : null;
    here = text ? onThisJob(limit, job) : null;
  } catch {
    text = null; // not complete yet; the fields say what is missing when saved
  }
  if (!text) return null;
  return (
    <p className="text-sm text-muted" aria-live="polite">
      {text}
      {here && <span className="block font-medium text-ink">{here}</span>}
    </p>
  );
}
