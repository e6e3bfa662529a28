// Lengths of free text that the tablet checks as it is typed and the server checks again on
// upload, so both refuse the same text in the same words. Plain constants and functions (no zod):
// the tablet's skip sheet imports this file. Each cap is what its database column holds.
import { canonicalText, unstorableTextProblem } from "./canonical-text";

/** readings.skip_reason is VARCHAR(255). */
export const SKIP_REASON_MAX = 255;

export const skipReasonTooLong = (length: number) =>
  `The skip reason is ${length} characters long; shorten it to ${SKIP_REASON_MAX} or fewer`;

/** What is wrong with a skip reason, in words, or undefined when it can be saved. */
export function skipReasonProblem(reason: string): string | undefined {
  const unstorable = unstorableTextProblem(reason, "The skip reason");
  if (unstorable) return unstorable;
  const text = canonicalText(reason).trim();
  if (!text) return "Say why the station is skipped";
  if (text.length > SKIP_REASON_MAX) return skipReasonTooLong(text.length);
  return undefined;
}
