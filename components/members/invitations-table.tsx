"use client";

import { useActionState, useState } from "react";
import { resendInvitationAction, revokeInvitationAction } from "@/app/(lab)/labs/[slug]/members/actions";
import type { ActionState } from "@/lib/http/action";
import { ROLE_LABELS, type Role } from "@/lib/permissions";
import { EmptyState } from "@/components/ui/empty-state";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { formatDateTime } from "@/lib/format/dates";

export type InvitationView = {
  id: number;
  email: string;
  role: Role;
  status: "pending" | "expired";
  expiresAt: Date;
  lastSentAt: Date;
  invitedByName: string | null;
};

async function invitationIntent(prev: ActionState, form: FormData): Promise<ActionState> {
  return form.get("intent") === "revoke" ? revokeInvitationAction(prev, form) : resendInvitationAction(prev, form);
}

export function InvitationsTable({
  slug,
  invitations,
  timeZone,
}: {
  slug: string;
  invitations: InvitationView[];
  /** The lab's IANA time zone: times are shown in it. */
  timeZone: string;
}) {
  const when = (d: Date) => formatDateTime(d, timeZone);
  const [state, action, pending] = useActionState<ActionState, FormData>(invitationIntent, {});
  // Stays mounted when the list empties, so the outcome of the last revoke stays on screen.
  return (
    <div className="space-y-3">
      <FormStatus ok={state.ok} message={state.message} />
      {invitations.length === 0 ? (
        <EmptyState title="No open invitations">
          Invitations you send appear here until they are accepted or revoked.
        </EmptyState>
      ) : (
        <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
          <table className="w-full min-w-[44rem] text-left text-sm">
            <caption className="sr-only">Open invitations</caption>
            <thead className="border-b border-line bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-4 py-2">
                  E-mail
                </th>
                <th scope="col" className="px-4 py-2">
                  Role
                </th>
                <th scope="col" className="px-4 py-2">
                  Status
                </th>
                <th scope="col" className="px-4 py-2">
                  Last sent
                </th>
                <th scope="col" className="px-4 py-2">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {invitations.map((inv) => (
                <tr key={inv.id} className="border-b border-line last:border-0" data-testid={`invitation-${inv.email}`}>
                  <td className="break-words px-4 py-2 font-medium">{inv.email}</td>
                  <td className="px-4 py-2">{ROLE_LABELS[inv.role]}</td>
                  <td className="px-4 py-2">
                    {inv.status === "expired" ? (
                      <span className="font-medium text-warn">Expired</span>
                    ) : (
                      <span>
                        Pending <span className="text-ink-faint">until {when(inv.expiresAt)}</span>
                      </span>
                    )}
                  </td>
                  <td className="px-4 py-2 text-ink-soft">
                    {when(inv.lastSentAt)}
                    {inv.invitedByName ? (
                      <span className="block text-xs text-ink-faint">by {inv.invitedByName}</span>
                    ) : null}
                  </td>
                  <td className="px-4 py-2">
                    <InvitationActions slug={slug} invitation={inv} action={action} pending={pending} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

function InvitationActions({
  slug,
  invitation,
  action,
  pending,
}: {
  slug: string;
  invitation: InvitationView;
  action: (f: FormData) => void;
  pending: boolean;
}) {
  const [confirming, setConfirming] = useState(false);
  const hidden = (intent: string) => (
    <>
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="intent" value={intent} />
      <input type="hidden" name="invitationId" value={invitation.id} />
    </>
  );
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form action={action}>
        {hidden("resend")}
        <button type="submit" disabled={pending} className={buttonClass("secondary", "px-3 py-1")}>
          Resend<span className="sr-only"> to {invitation.email}</span>
        </button>
      </form>
      {confirming ? (
        <form action={action} className="flex items-center gap-2">
          {hidden("revoke")}
          <button type="submit" disabled={pending} className={buttonClass("danger", "px-3 py-1")} autoFocus>
            Confirm revoke
          </button>
          <button type="button" onClick={() => setConfirming(false)} className={buttonClass("secondary", "px-3 py-1")}>
            Cancel
          </button>
        </form>
      ) : (
        <button type="button" onClick={() => setConfirming(true)} className={buttonClass("ghost", "px-3 py-1")}>
          Revoke…<span className="sr-only"> invitation to {invitation.email}</span>
        </button>
      )}
    </div>
  );
}
