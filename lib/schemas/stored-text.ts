import { z } from "zod";
import { canonicalText, unstorableTextProblem } from "./canonical-text";

// The zod side of the stored text form (canonical-text.ts says what that form is).

/**
 * A zod string in the stored form: refused when it holds characters that cannot be stored, then
 * canonical (LF, NFC). Chain `.trim()`, `.min()`, `.max()`, `.email()` after it: they then check the
 * text as it will be stored. `what` names the field in the refusal ("The note"); `error` is the
 * message when the input is not text at all.
 */
export function storedText(what: string, error?: string) {
  return z
    .string(error ?? `${what} must be text`)
    .refine((text) => !unstorableTextProblem(text, what), {
      abort: true,
      error: (issue) => unstorableTextProblem(String(issue.input), what),
    })
    .overwrite(canonicalText);
}
