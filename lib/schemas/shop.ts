// Starting a shop: the public sign-up form and its route, and `npm run shop:create`, which takes
// the same fields without a password (its admin sets one through a one-time link).
import { z } from "zod";
import { UNIT_SYSTEMS } from "@/lib/schemas/enums";
import { passwordLengthProblem } from "@/lib/schemas/password";

const email = z
  .string({ error: "Enter an e-mail address" })
  .trim()
  .min(1, "Enter an e-mail address")
  .email("Enter an e-mail like name@shop.com")
  .max(191, "That e-mail is too long")
  .transform((e) => e.toLowerCase());

export const newShopSchema = z.strictObject({
  shopName: z
    .string({ error: "Enter the shop's name" })
    .trim()
    .min(2, "Enter the shop's name (at least 2 characters)")
    .max(120, "Keep the shop's name to 120 characters"),
  unitSystem: z.enum(UNIT_SYSTEMS, { error: "Pick inch or metric" }),
  adminName: z
    .string({ error: "Enter your name" })
    .trim()
    .min(1, "Enter your name")
    .max(120, "Keep the name to 120 characters"),
  email,
});
export type NewShopInput = z.output<typeof newShopSchema>;

/** POST /api/shops: the public sign-up (the common-password check runs on the server, words included). */
export const shopSignUpSchema = newShopSchema.extend({
  password: z.string({ error: "Choose a password" }).superRefine((p, ctx) => {
    const problem = passwordLengthProblem(p);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  }),
});
export type ShopSignUpValues = z.input<typeof shopSignUpSchema>;
export type ShopSignUpInput = z.output<typeof shopSignUpSchema>;

/** POST /api/shops/verify: the token from the e-mailed link. */
export const verifyShopSchema = z.strictObject({
  token: z.string({ error: "The link has no token" }).trim().min(1, "The link has no token").max(200),
});

/** POST /api/shops/resend: a new confirmation link to the first admin of a shop still waiting. */
export const resendShopLinkSchema = z.strictObject({ email });

/** The steps of the first-job guide on the desk, in order. */
export const GUIDE_STEPS = ["gauge", "sheet", "job", "bench"] as const;
export type GuideStep = (typeof GUIDE_STEPS)[number];

/** GET /api/shops/guide: which steps are done, and the job to open on the bench once there is one. */
export type GuideState = { done: Record<GuideStep, boolean>; firstJobId: number | null };
