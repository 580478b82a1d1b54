import { z } from "zod";
import { freeText } from "./text";
import { PASSWORD_MIN } from "@/lib/validation/password-rules";
import { emailField } from "./members";

// bcrypt reads at most 72 bytes: count bytes, not characters.
export const newPasswordField = z
  .string({ error: "Choose a password." })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .refine((s) => new TextEncoder().encode(s).length <= 72, "Use at most 72 bytes (about 72 letters).");

const passwordPair = { password: newPasswordField, confirm: z.string({ error: "Repeat the password." }) };
const samePassword = (d: { password: string; confirm: string }) => d.password === d.confirm;
const mismatch = { message: "The two passwords differ.", path: ["confirm"] };

export const tokenField = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is not valid.");

export const acceptNewAccountSchema = z
  .object({
    token: tokenField,
    name: freeText({
      what: "Name",
      min: 2,
      max: 120,
      requiredMessage: "Enter your name.",
      minMessage: "Enter your name (at least 2 characters).",
      maxMessage: "Use at most 120 characters.",
    }),
    ...passwordPair,
  })
  .refine(samePassword, mismatch);

export const acceptAsMemberSchema = z.object({ token: tokenField });

export const forgotPasswordSchema = z.object({ email: emailField });

export const resetPasswordSchema = z.object({ token: tokenField, ...passwordPair }).refine(samePassword, mismatch);
