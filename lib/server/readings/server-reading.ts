import "server-only";
import { READING_FIELDS, type StoredReading } from "@/lib/schemas/readings";
import type { ServerReading } from "@/lib/schemas/sync";

// A stored reading as the tablet gets it (job pack and sync feed).

const iso = (d: Date | string) => (d instanceof Date ? d : new Date(d)).toISOString();

const SERVER_FIELDS = READING_FIELDS.filter((k) => k !== "shopId");

/** The tablet's view of a stored reading (field by field: a feed page maps a thousand of them). */
export function toServerReading(r: StoredReading, supersededBy: string | null): ServerReading {
  const out: Record<string, unknown> = {};
  for (const k of SERVER_FIELDS) out[k] = r[k];
  out.supersededBy = supersededBy;
  out.takenAt = iso(r.takenAt);
  out.receivedAt = iso(r.receivedAt);
  return out as ServerReading;
}
