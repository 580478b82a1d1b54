// Whether an invitation link may be accepted, and by whom. Pure: the operation reads the locked
// invitation and the account (db/queries/invitations.ts) and writes only when this says yes.
import { AppError } from "@/lib/errors";
import { linkState } from "@/lib/link-state";

const LINK_PROBLEM = {
  expired: "This invitation has expired. Ask the lab's manager to resend it.",
  used: "This invitation has already been used. Sign in to open the lab.",
  revoked: "This invitation was withdrawn by the lab's manager.",
} as const;

export type AcceptanceFacts = {
  invitation: { email: string; expiresAt: Date; acceptedAt: Date | null; revokedAt: Date | null } | null;
  /** A new account from the link (is its address taken?), or a signed-in person's account. */
  joiner: { kind: "new-account"; addressTaken: boolean } | { kind: "member"; account: { email: string } | null };
};

/** The refusal (404, 409 or 403) for accepting this invitation, or null when it may be accepted. */
export function acceptanceRefusal({ invitation: inv, joiner }: AcceptanceFacts, now = new Date()): AppError | null {
  if (!inv)
    return new AppError("not_found", "This invitation link is not valid. Check that you copied the whole link.");
  const state = linkState({ expiresAt: inv.expiresAt, usedAt: inv.acceptedAt, revokedAt: inv.revokedAt }, now);
  if (state !== "valid") return new AppError("conflict", LINK_PROBLEM[state]);
  if (joiner.kind === "new-account")
    return joiner.addressTaken
      ? new AppError("conflict", `An account already uses ${inv.email}. Sign in with it to accept the invitation.`)
      : null;
  if (joiner.account?.email !== inv.email)
    return new AppError("forbidden", `This invitation is for ${inv.email}. Sign in with that address to accept it.`);
  return null;
}
