import { z } from "zod";
import { ROLES, type UnitSystem } from "@/lib/schemas/enums";
import { storedText } from "./stored-text";

// One schema per entity, shared by the admin's forms and the route handlers.
const role = z.enum(ROLES, { error: "Choose a role: machinist, lead, inspector or admin" });

export const inviteUserSchema = z.object({
  name: storedText("The name", "Enter the person's name")
    .trim()
    .min(1, "Enter the person's name")
    .max(120, "Keep the name under 120 characters"),
  email: storedText("The e-mail", "Enter an e-mail address")
    .trim()
    .min(1, "Enter an e-mail address")
    .email("Enter an e-mail like name@shop.com")
    .max(191, "That e-mail is too long")
    .transform((e) => e.toLowerCase()),
  role,
});

export const updateUserSchema = z
  .object({ role: role.optional(), active: z.boolean({ error: "active must be true or false" }).optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.active !== undefined, {
    message: "Say what to change: a new role, or active true/false",
    path: ["_"],
  });

/** What the form holds (before trimming and lower-casing). */
export type InviteUserValues = z.input<typeof inviteUserSchema>;
export type InviteUserInput = z.infer<typeof inviteUserSchema>;
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

/** What the admin screens get for each person; never a password or its hash. */
export type AdminUser = {
  id: number;
  name: string;
  email: string;
  role: (typeof ROLES)[number];
  active: boolean;
  lastSignInAt: string | null;
  createdAt: string;
};

/** The shop as GET /api/me gives it. */
export type ShopRecord = { id: number; name: string; unitSystem: UnitSystem; guardBandPolicy: string };

/** Whom a customer asks about their record (shown when a record link has expired). */
export type ShopContact = { name: string; email: string | null; phone: string | null };
