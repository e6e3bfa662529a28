"use client";

import { resolveLimit, unitWords, type SpecLimit } from "@/lib/domain";
import { compactLimit, type LimitInput, type LimitValues } from "@/lib/schemas/spec";

// What the limit comes to, worked out by the core (resolveLimit) as the lead types, so a
// slip such as a swapped tolerance shows before it is saved.

function words(l: LimitInput): string | null {
  if (l.limitType === "per_inch") {
    const parts = [l.perInchMin, l.perInchMax].map((x) => (typeof x === "number" && Number.isFinite(x) ? x : null));
    if (parts.every((x) => x === null)) return null;
    const per = `${unitWords(l.unit)} per ${l.unit === "mm" ? "mm" : "inch"} of diameter`;
    if (parts[0] === null) return `Scales with the diameter: up to ${parts[1]} ${per}`;
    if (parts[1] === null) return `Scales with the diameter: ${parts[0]} ${per} or more`;
    return `Scales with the diameter: ${parts[0]} to ${parts[1]} ${per}`;
  }
  if (l.limitType === "iso286" && (l.nominal === null || l.nominal === undefined)) {
    return l.isoClass ? `ISO 286 ${l.isoClass} at the engine's nominal size` : null;
  }
  const clean = compactLimit(l as LimitValues) as unknown as SpecLimit;
  const r = resolveLimit(clean);
  const u = unitWords(r.unit);
  const nominal = r.nominal !== undefined ? ` (nominal ${r.nominal})` : "";
  if (r.min === undefined) return `Accepts up to ${r.max} ${u}`;
  if (r.max === undefined) return `Accepts ${r.min} ${u} or more`;
  return `Accepts ${r.min} to ${r.max} ${u}${nominal}`;
}

export function SpecLimitPreview({ limit }: { limit: LimitInput }) {
  let text: string | null;
  try {
    text = limit.characteristic && limit.limitType ? words(limit) : null;
  } catch {
    text = null; // not complete yet; the fields say what is missing when saved
  }
  if (!text) return null;
  return (
    <p className="text-sm text-muted" aria-live="polite">
      {text}
    </p>
  );
}
