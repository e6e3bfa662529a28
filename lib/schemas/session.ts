import { z } from "zod";
import { storedText } from "./stored-text";
import type { Role } from "./enums";

export const signInSchema = z.object({
  email: storedText("The e-mail")
    .trim()
    .min(1, "Enter your e-mail")
    .email("Enter an e-mail like name@shop.com")
    .max(191),
  password: z.string().min(1, "Enter your password").max(200, "That password is too long"),
});

export type SignInInput = z.infer<typeof signInSchema>;

/** Who is asking: the signed-in user as the server checked them on this request. */
export type Actor = {
  userId: number;
  shopId: number;
  role: Role;
  name: string;
  email: string;
  /** The sign-in this request came with; absent for an actor made outside a request (scripts, tests). */
  sessionId?: string;
  /** Signed in with a temporary password from an admin: only the change of password is open. */
  mustChangePassword?: boolean;
};

/** A tablet reporting a sign-out it made offline names the session it ended. */
export const signOutSchema = z.object({
  sessionId: z
    .string()
    .regex(/^[0-9a-f]{32}$/, "A session id is 32 hexadecimal characters")
    .optional(),
});
