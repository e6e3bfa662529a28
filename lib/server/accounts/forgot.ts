import "server-only";
import { addressBucket } from "@/lib/server/core/ip";
import { limit, spendAttempt } from "@/lib/server/throttle/throttle";
import { enqueueAccountMail } from "./link-mail";
import { findActiveAccountsByEmail } from "./repo";

// "Forgot password": a reset link to every active account with the address, and the same answer
// whether there is one or not, so the form cannot be used to learn who has an account. Requests
// are counted per address typed and per client address, whatever they find, so the form cannot
// flood someone's mailbox or be used to probe at speed.

export const FORGOT_ANSWER =
  "If an account uses that address, a message with a link to choose a new password is on its way. " +
  "The link works once, for one hour. Nothing arrived within a few minutes? Check the spam folder, " +
  "or ask your shop's admin.";

/** Reset links asked for: three an hour for one address typed, twenty an hour from one client. */
export const RESET_RULES = {
  email: { windowMinutes: 60, limit: 3, lockMinutes: 60 },
  client: { windowMinutes: 60, limit: 20, lockMinutes: 60 },
} as const;

const waitWords = (minutes: number) =>
  `Several reset links were asked for already. Use the latest message, or try again in ${minutes} min.`;

/** Queues the links and answers the words; `shopIds` are the shops a link was queued in (for delivery, never shown). */
export async function requestPasswordReset(
  email: string,
  clientAddress: string,
): Promise<{ message: string; shopIds: number[] }> {
  await spendAttempt(
    [
      limit(`reset:email:${email.trim().toLowerCase()}`, RESET_RULES.email),
      limit(`reset:address:${addressBucket(clientAddress)}`, RESET_RULES.client),
    ],
    waitWords,
  );
  const accounts = await findActiveAccountsByEmail(email);
  for (const account of accounts)
    await enqueueAccountMail(null, "password_reset", { userId: account.id, shopId: account.shopId });
  return { message: FORGOT_ANSWER, shopIds: accounts.map((a) => a.shopId) };
}
