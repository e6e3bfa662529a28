import "server-only";
import type { AuditChange } from "@/lib/schemas/audit";
import { pathWords } from "@/lib/server/log/field-words";

// Before/after of an audit event as a readable list of changed fields: nested objects flattened
// to dotted paths ("limits.0.max"), values as short text. Pure.

const MAX_CHANGES = 200;
const MAX_TEXT = 300;

type Flat = Map<string, string>;

function text(v: unknown): string {
  const s = typeof v === "string" ? v : JSON.stringify(v);
  return s.length > MAX_TEXT ? `${s.slice(0, MAX_TEXT - 1)}…` : s;
}

function flatten(value: unknown, path: string, out: Flat): void {
  if (value !== null && typeof value === "object") {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    if (entries.length === 0) out.set(path || "(value)", Array.isArray(value) ? "[]" : "{}");
    for (const [k, v] of entries) flatten(v, path ? `${path}.${k}` : k, out);
    return;
  }
  if (value !== undefined) out.set(path || "(value)", value === null ? "null" : text(value));
}

/** Every field that differs between before and after (a create has only "added", a delete only "removed"). */
export function diffJson(before: unknown, after: unknown): { changes: AuditChange[]; truncated: boolean } {
  const a: Flat = new Map();
  const b: Flat = new Map();
  if (before !== null && before !== undefined) flatten(before, "", a);
  if (after !== null && after !== undefined) flatten(after, "", b);
  const paths = [...new Set([...a.keys(), ...b.keys()])];
  const changes: AuditChange[] = [];
  for (const path of paths) {
    const was = a.get(path);
    const is = b.get(path);
    if (was === is) continue;
    const kind = was === undefined ? "added" : is === undefined ? "removed" : "changed";
    changes.push({ path, label: pathWords(path), kind, before: was ?? null, after: is ?? null });
  }
  return { changes: changes.slice(0, MAX_CHANGES), truncated: changes.length > MAX_CHANGES };
}
