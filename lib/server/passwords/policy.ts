import "server-only";
import { dictionary } from "@zxcvbn-ts/language-common";
import { AppError } from "@/lib/server/core/errors";
import { passwordLengthProblem } from "@/lib/schemas/password";

// Whether a new password may be used: the length rules everyone sees while typing, and a check
// against passwords known to be common (the list shipped with @zxcvbn-ts/language-common, about
// 49,000 entries, read from the package: no network). NIST SP 800-63B (rev. 3), 5.1.1.2, asks for
// such a check against lists of commonly used or breached values, and for context words such as
// the person's own e-mail address.

let common: Set<string> | undefined;

function commonPasswords(): Set<string> {
  common ??= new Set((dictionary["passwords-common"] as string[]).map((p) => p.toLowerCase()));
  return common;
}

/** The words refusing `password`, or null when it may be used. */
export function passwordProblem(password: string, person: { email?: string; name?: string } = {}): string | null {
  const length = passwordLengthProblem(password);
  if (length) return length;
  const lower = password.toLowerCase();
  if (commonPasswords().has(lower))
    return "That password is on a list of common passwords that attackers try first. Choose something less usual.";
  const own = [person.email, person.email?.split("@")[0], person.name].filter((w): w is string => !!w && w.length >= 4);
  if (own.some((w) => lower === w.toLowerCase() || lower.replace(/\s+/g, "") === w.toLowerCase().replace(/\s+/g, "")))
    return "Do not use your own name or e-mail address as your password.";
  return null;
}

/** Throws a 422 naming `field` when the password may not be used. */
export function assertPasswordAllowed(password: string, person: { email?: string; name?: string }, field: string) {
  const problem = passwordProblem(password, person);
  if (problem) throw new AppError("invalid", problem, { [field]: [problem] });
}
