import { z } from "zod";

export const signInSchema = z.object({
  email: z.string().trim().min(1, "Enter your e-mail").email("Enter an e-mail like name@shop.com").max(191),
  password: z.string().min(1, "Enter your password").max(200, "That password is too long"),
});

export type SignInInput = z.infer<typeof signInSchema>;
