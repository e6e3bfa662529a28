import { z } from "zod";

// The password rules a person sees while typing, shared by the forms and the route handlers. The
// check against commonly used passwords needs a large list, so it runs on the server only
// (lib/server/passwords/policy.ts) and its words come back as the field's error.

/**
 * At least 12 characters. NIST SP 800-63B (rev. 3), 5.1.1.2, asks verifiers to accept nothing
 * under 8 characters for a secret the person chooses; a shop's accounts open build records and
 * sign releases, so we ask for more. No rules about kinds of characters: the same section advises
 * against them, and a long phrase is easier to type on a tablet than symbols.
 */
export const PASSWORD_MIN_LENGTH = 12;

/** bcrypt reads only the first 72 bytes of a password; anything after would be silently ignored. */
export const PASSWORD_MAX_BYTES = 72;

const byteLength = (s: string) => new TextEncoder().encode(s).length;
const characters = (s: string) => Array.from(s).length;

/** The words for a new password that breaks the length rules, or null when it keeps them. */
export function passwordLengthProblem(password: string): string | null {
  const n = characters(password);
  if (n < PASSWORD_MIN_LENGTH)
    return `Use at least ${PASSWORD_MIN_LENGTH} characters (${n} so far). A few words in a row is easy to remember.`;
  if (byteLength(password) > PASSWORD_MAX_BYTES)
    return `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters); longer is cut short.`;
  return null;
}

/** A password someone chooses: the length rules; the server adds the common-password check. */
export const newPassword = z.string({ error: "Choose a password" }).superRefine((value, ctx) => {
  const problem = passwordLengthProblem(value);
  if (problem) ctx.addIssue({ code: "custom", message: problem });
});

const linkToken = z
  .string({ error: "The link is missing its code; open it again from the message" })
  .min(16, "The link is incomplete; open it again from the message")
  .max(200, "The link is not one we sent");

/** Setting a password from an e-mailed link (an invitation or a reset). */
export const setPasswordSchema = z.object({ token: linkToken, password: newPassword });

/** Changing one's own password while signed in. */
export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: "Enter your current password" }).min(1, "Enter your current password").max(200),
  newPassword,
});

/** Asking for a reset link. */
export const forgotPasswordSchema = z.object({
  email: z
    .string({ error: "Enter your e-mail" })
    .trim()
    .min(1, "Enter your e-mail")
    .email("Enter an e-mail like name@shop.com")
    .max(191, "That e-mail is too long")
    .transform((e) => e.toLowerCase()),
});

export type SetPasswordInput = z.infer<typeof setPasswordSchema>;
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

/** What the page behind an e-mailed link shows: the form for this person, or why the link cannot be used. */
export type LinkPageState =
  { holder: { name: string; email: string; shopName: string; expiresAt: string } } | { problem: string };
