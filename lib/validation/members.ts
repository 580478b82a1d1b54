import { z } from "zod";
import { ROLES } from "@/lib/permissions";

export const emailField = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "An e-mail address has at most 254 characters.")
  .pipe(z.email("Enter a valid e-mail address, like name@hospital.example."))
  .transform((s) => s.toLowerCase());

export const roleField = z.enum(ROLES, { error: `Choose a role: ${ROLES.join(", ")}.` });

export const inviteSchema = z.object({ email: emailField, role: roleField });

export const changeRoleSchema = z.object({ role: roleField });
