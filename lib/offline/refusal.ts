// A batch the server refused as a whole (400, 413, 415, 422 without per-reading results) is never
// sent again unchanged: its field errors name readings ("readings.3.note"), and those are the ones
// refused; the rest go again at once. A refusal that names none is narrowed down by sending the
// batch's readings one at a time, so only the reading the server will not take ends refused.
import type { FieldErrors } from "@/lib/schemas/errors";
import type { LocalReading } from "./db";

export type Rejection = NonNullable<LocalReading["rejection"]>;

// The contract keys a reading's fields "readings.<index>.<field>"; "items." is accepted too.
const ITEM_KEY = /^(?:readings|items)\.(\d+)(?:\.(.+))?$/;

/** The field errors that name readings of a batch of `count`, by index, keyed by the reading's own field. */
export function errorsByReading(fields: FieldErrors, count: number): Map<number, FieldErrors> {
  const out = new Map<number, FieldErrors>();
  for (const [key, messages] of Object.entries(fields)) {
    const m = ITEM_KEY.exec(key);
    const index = m ? Number(m[1]) : -1;
    if (index < 0 || index >= count) continue;
    const own = out.get(index) ?? {};
    (own[m![2] ?? "_"] ??= []).push(...messages);
    out.set(index, own);
  }
  return out;
}

/** The rejection a reading keeps: the server's words, field by field, as the bench shows them. */
export function rejectionOf(code: string, message: string, errors?: FieldErrors): Rejection {
  const words = errors ? Object.values(errors).flat() : [];
  return { code, reason: words.length ? words.join("; ") : message, ...(errors ? { errors } : {}) };
}
