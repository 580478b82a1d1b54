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

/** Ids in paths and hidden fields. */
export const idField = z.coerce
  .number({ error: "Must be a number." })
  .int("Must be a whole number.")
  .positive("Must be a positive id.")
  .max(Number.MAX_SAFE_INTEGER, "Too large.");

export const idParam = z.object({ id: idField });

export const memberIdSchema = z.object({ membershipId: idField });
export const memberRoleFormSchema = z.object({ membershipId: idField, role: roleField });
export const invitationIdSchema = z.object({ invitationId: idField });
