import Link from "next/link";
import { VerifyEmailForm } from "@/components/auth/verify-email-form";
import { readVerificationLink } from "@/lib/ops/sign-up";

export const metadata = { title: "Confirm your e-mail address" };

const PROBLEM = {
  expired: "This confirmation link has expired. Sign in and ask for a new one.",
  used: "This confirmation link has already been used (or a newer one was sent). Sign in to continue.",
  revoked: "This confirmation link is no longer valid. Sign in and ask for a new one.",
} as const;

// A button, not a confirmation on opening: mail scanners that fetch links change nothing.
export default async function VerifyEmailPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = await readVerificationLink({ token });
  return (
    <div>
      <h1 className="text-2xl font-bold">Confirm your e-mail address</h1>
      {!link ? (
        <p className="mt-3">This confirmation link is not valid. Check that you copied the whole link.</p>
      ) : link.state !== "valid" ? (
        <p className="mt-3">{PROBLEM[link.state]}</p>
      ) : (
        <>
          <p className="mt-2">
            {link.kind === "sign-up" ? (
              <>
                Confirm <strong>{link.email}</strong> as the address of your new Forkwall account.
              </>
            ) : (
              <>
                Move your Forkwall account from <strong>{link.currentEmail}</strong> to <strong>{link.email}</strong>.
              </>
            )}
          </p>
          <VerifyEmailForm
            token={token}
            label={link.kind === "sign-up" ? "Confirm my address" : "Use this address from now on"}
          />
        </>
      )}
      <p className="mt-6 text-sm">
        <Link href="/sign-in" className="text-brand-700 underline">
          Sign in
        </Link>
      </p>
    </div>
  );
}
