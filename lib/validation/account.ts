import { z } from "zod";
import { PASSWORD_MAX } from "@/lib/validation/password-rules";
import { newPasswordField, tokenField } from "./auth";
import { emailField } from "./members";
import { freeText } from "./text";

export const personName = freeText({
  what: "Name",
  min: 2,
  max: 120,
  requiredMessage: "Enter your name.",
  minMessage: "Enter your name (at least 2 characters).",
  maxMessage: "Use at most 120 characters.",
});

const currentPassword = z
  .string({ error: "Enter your current password." })
  .min(1, "Enter your current password.")
  .max(PASSWORD_MAX, "That is not your current password.");

/** Sign-up: the same for the page and `POST /api/v1/accounts`. */
export const signUpSchema = z.strictObject({ name: personName, email: emailField, password: newPasswordField });
export type SignUpInput = z.output<typeof signUpSchema>;

export const verifyEmailSchema = z.object({ token: tokenField });

export const changeNameSchema = z.object({ name: personName });

export const changeEmailSchema = z.object({ email: emailField, currentPassword });

export const changePasswordSchema = z
  .object({ currentPassword, password: newPasswordField, confirm: z.string({ error: "Repeat the password." }) })
  .refine((d) => d.password === d.confirm, { message: "The two passwords differ.", path: ["confirm"] });
