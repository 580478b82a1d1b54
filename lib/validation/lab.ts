import { z } from "zod";
import { freeText } from "./text";

// A lab's slug is part of every address (/labs/<slug>, /api/v1/labs/<slug>), so it is kept to
// characters that need no escaping and words that cannot be mistaken for a page.
export const SLUG_MIN = 3;
export const SLUG_MAX = 48;
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/**
 * Words a lab may not take as its slug: pages and API segments beside /labs/<slug>, and words
 * that would read as the product's own (the one list; the form, the API and the CLI use it).
 */
export const RESERVED_SLUGS: ReadonlySet<string> = new Set([
  "new",
  "api",
  "admin",
  "settings",
  "account",
  "accounts",
  "auth",
  "dashboard",
  "dev",
  "help",
  "labs",
  "lab",
  "login",
  "logout",
  "sign-in",
  "sign-out",
  "sign-up",
  "signin",
  "signup",
  "invite",
  "verify",
  "verify-email",
  "check-email",
  "reset-password",
  "forgot-password",
  "calculator",
  "static",
  "public",
  "www",
  "mail",
  "support",
  "system",
  "root",
  "forkwall",
  "demo",
  "test",
]);

export const slugField = z
  .string({ error: "Choose a short name for the address (the slug)." })
  .trim()
  .min(SLUG_MIN, `Use at least ${SLUG_MIN} characters.`)
  .max(SLUG_MAX, `Use at most ${SLUG_MAX} characters.`)
  .regex(
    SLUG_PATTERN,
    "Use lower-case letters, digits and single hyphens, not at the start or end (for example north-cath-lab).",
  )
  .refine((s) => !RESERVED_SLUGS.has(s), "That word is reserved; choose another.");

export const LAB_NAME_MAX = 160;

// A lab's name goes into invitation subjects and bodies, where mail programs turn addresses
// into links: a name must not carry a web or e-mail address. Checked on the NFKC form with the
// full stops of other scripts read as ".", so look-alike characters do not slip through.
const LINK_DOTS = /[\u3002\uFF0E\uFF61]/g;
const EMAIL_LIKE = /[^\s@]@[^\s@]/;
const URL_LIKE = [
  /[a-z][a-z0-9+.-]*:\/\//i,
  /\b(?:mailto|javascript|data):/i,
  /\bwww\./i,
  /[a-z0-9]\.[a-z]{2,24}\b/i, // a host name such as evil.example
];
const linkForm = (s: string) => s.normalize("NFKC").replace(LINK_DOTS, ".");

/** Why a lab name cannot be used in mail, or null when it can. */
export function labNameLinkProblem(name: string): string | null {
  const s = linkForm(name);
  if (EMAIL_LIKE.test(s)) return "A lab name cannot contain an e-mail address.";
  if (URL_LIKE.some((re) => re.test(s)))
    return 'A lab name cannot contain a web address (write abbreviations with a space, as in "St. Anne").';
  return null;
}

/** The one lab-name schema (new labs, the operator's command, renaming in settings). */
export const labNameField = freeText({
  what: "Lab name",
  min: 2,
  max: LAB_NAME_MAX,
  requiredMessage: "Enter the lab name.",
  minMessage: "Enter the lab name (at least 2 characters).",
}).superRefine((name, ctx) => {
  const problem = labNameLinkProblem(name);
  if (problem) ctx.addIssue({ code: "custom", message: problem });
});

export const createLabSchema = z.strictObject({ name: labNameField, slug: slugField });
export type CreateLabInput = z.output<typeof createLabSchema>;

/** A slug suggested from a lab's name: accents dropped, anything else becomes one hyphen. */
export function suggestSlug(name: string): string {
  const base = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, SLUG_MAX)
    .replace(/-+$/, "");
  if (base.length >= SLUG_MIN && !RESERVED_SLUGS.has(base)) return base;
  if (base.length === 0) return "";
  return `${base}-lab`.slice(0, SLUG_MAX);
}
