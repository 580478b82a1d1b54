import "server-only";
import { z } from "zod";
import { isEmailVerified } from "@/db/queries/accounts";
import { createInvitation } from "@/db/queries/invitations";
import { createLab as insertLab, slugTaken } from "@/db/queries/lab-create";
import { labLimits } from "@/lib/auth/lab-limits";
import { INVITATION_TTL_MS, newToken } from "@/lib/auth/tokens";
import { AppError, isAppError } from "@/lib/errors";
import { createLabSchema, type CreateLabInput } from "@/lib/validation/lab";
import { emailField } from "@/lib/validation/members";
import { signedIn } from "./access";
import type { Caller } from "./caller";
import { invitationLink, mailInvitation } from "./members";
import { parseInput, traced } from "./operation";
import { accountWrite, duplicateKey } from "./write";
import type { Tx } from "@/db/queries/audit";

const slugConflict = (slug: string) =>
  new AppError("conflict", `The address /labs/${slug} is already taken; choose another slug.`, [
    { path: ["slug"], message: "Already taken: choose another." },
  ]);

/** Inserts the lab inside `fn`'s transaction; a taken slug (checked, or lost in a race) is 409. */
async function withNewLab<T>(input: CreateLabInput, fn: (tx: Tx) => Promise<T>): Promise<T> {
  try {
    return await accountWrite(async (tx) => {
      if (await slugTaken(tx, input)) throw slugConflict(input.slug);
      return fn(tx);
    });
  } catch (err) {
    if (duplicateKey(err) !== null || (isAppError(err) && err.code === "conflict" && !err.issues))
      throw slugConflict(input.slug);
    throw err;
  }
}

/**
 * A signed-in person with a confirmed address creates a lab and becomes its manager; at most
 * LABS_PER_ACCOUNT_PER_DAY a day (429).
 */
export async function createLab(caller: Caller, raw: unknown) {
  const user = signedIn(caller);
  if (!(await isEmailVerified({ userId: user.id })))
    throw new AppError("forbidden", "Confirm your e-mail address before creating a lab: open the link we sent you.");
  const input = parseInput(createLabSchema, raw);
  return traced("lab.create", { userId: user.id }, async () => {
    const lab = await labLimits().labCreation(user.id, () =>
      withNewLab(input, (tx) => insertLab(tx, { ...input, managerUserId: user.id, actorUserId: user.id, via: "web" })),
    );
    return { lab: { slug: lab.slug, name: lab.name }, role: "manager" as const };
  });
}

export const operatorLabSchema = createLabSchema.extend({ manager: emailField });

/**
 * For self-hosted installs (npm run lab:create): an empty lab whose first manager is invited by
 * e-mail (the same invitation row and e-mail as the Members page), so the manager proves the
 * address by accepting.
 */
export async function createLabByOperator(raw: z.input<typeof operatorLabSchema>) {
  const input = parseInput(operatorLabSchema, raw);
  return traced("lab.create", {}, async () => {
    const { token, hash } = newToken();
    const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
    const { lab, invitation } = await withNewLab(input, async (tx) => {
      const lab = await insertLab(tx, {
        name: input.name,
        slug: input.slug,
        managerUserId: null,
        actorUserId: null,
        via: "cli",
      });
      const invitation = await createInvitation(tx, {
        labId: lab.id,
        email: input.manager,
        role: "manager",
        invitedBy: null,
        tokenHash: hash,
        expiresAt,
      });
      return { lab, invitation };
    });
    const emailSent = await mailInvitation(
      {
        labId: lab.id,
        labName: lab.name,
        inviterName: "The operator of this Forkwall installation",
        timeZone: "UTC", // a new lab starts in UTC until its manager sets its zone
      },
      invitation.email,
      "manager",
      token,
      expiresAt,
    );
    // Without mail the operator (who holds the database anyway) hands the link over by hand.
    return {
      lab: { slug: lab.slug, name: lab.name },
      invitation: { email: invitation.email, expiresAt },
      emailSent,
      ...(emailSent ? {} : { link: invitationLink(token) }),
    };
  });
}
