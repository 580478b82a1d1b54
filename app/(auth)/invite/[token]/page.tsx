import Link from "next/link";
import { AcceptInvitationForm } from "@/components/auth/accept-invitation-form";
import { JoinLabForm } from "@/components/auth/join-lab-form";
import { buttonClass } from "@/components/ui/button";
import { FormStatus } from "@/components/ui/form-status";
import { readInvitationLink } from "@/lib/ops/accounts";
import { currentUser } from "@/lib/auth/session";
import { formatUtc } from "@/lib/mail/templates";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata = { title: "Invitation" };

const PROBLEMS = {
  missing: "This invitation link is not valid. Check that you copied the whole link from the e-mail.",
  expired: "This invitation has expired. Ask the lab's manager to resend it.",
  used: "This invitation has already been used. Sign in to open the lab.",
  revoked: "This invitation was withdrawn by the lab's manager.",
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = await readInvitationLink({ token });
  const problem = !inv ? "missing" : inv.state === "valid" ? null : inv.state;
  if (!inv || problem) {
    return (
      <div>
        <h1 className="text-2xl font-bold">Invitation</h1>
        <FormStatus message={PROBLEMS[problem ?? "missing"]} className="mt-4" />
        <Link href="/sign-in" className={buttonClass("secondary", "mt-6")}>
          Go to sign-in
        </Link>
      </div>
    );
  }
  const user = await currentUser().catch(() => null);
  const role = ROLE_LABELS[inv.role];
  const here = `/invite/${token}`;
  return (
    <div>
      <p className="text-sm font-medium uppercase tracking-wide text-brand-600">Invitation</p>
      <h1 className="mt-1 text-2xl font-bold">Join {inv.labName}</h1>
      <dl className="mt-4 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-faint">For</dt>
        <dd className="font-medium">{inv.email}</dd>
        <dt className="text-ink-faint">Role</dt>
        <dd className="font-medium">{role}</dd>
        <dt className="text-ink-faint">Link expires</dt>
        <dd>{formatUtc(inv.expiresAt)}</dd>
      </dl>
      {user && user.email === inv.email ? (
        <JoinLabForm token={token} labName={inv.labName} role={role} />
      ) : user ? (
        <div className="mt-6 space-y-4">
          <FormStatus
            message={`You are signed in as ${user.email}, but this invitation is for ${inv.email}. Sign out, then open this link again.`}
          />
          <Link href="/sign-out" className={buttonClass("secondary")}>
            Sign out
          </Link>
        </div>
      ) : inv.hasAccount ? (
        <div className="mt-6 space-y-4">
          <p className="text-ink-soft">
            An account already uses this address. Sign in with it and you can accept the invitation.
          </p>
          <Link
            href={`/sign-in?${new URLSearchParams({ callbackUrl: here, email: inv.email })}`}
            className={buttonClass("primary")}
          >
            Sign in to accept
          </Link>
        </div>
      ) : (
        <>
          <p className="mt-6 text-ink-soft">
            Create your account: choose the name your colleagues will see, and a password.
          </p>
          <AcceptInvitationForm token={token} email={inv.email} />
        </>
      )}
    </div>
  );
}
