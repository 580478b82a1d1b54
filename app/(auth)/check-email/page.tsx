import Link from "next/link";
import { redirect } from "next/navigation";
import { ResendVerificationForm } from "@/components/auth/resend-verification-form";
import { sessionCaller } from "@/lib/ops/caller";
import { needsVerification } from "@/lib/ops/sign-up";

export const metadata = { title: "Check your e-mail" };

// Where a new account waits: the address is named only to its signed-in owner (never from the URL).
export default async function CheckEmailPage() {
  const caller = await sessionCaller();
  const signedIn = caller.kind === "user";
  if (signedIn && !(await needsVerification(caller))) redirect("/dashboard");
  return (
    <div>
      <h1 className="text-2xl font-bold">Check your e-mail</h1>
      {signedIn ? (
        <>
          <p className="mt-2">
            We sent a link to <strong data-testid="unverified-email">{caller.user.email}</strong>. Open it to confirm
            the address; until then this account can do nothing else.
          </p>
          <p className="mt-2 text-sm text-ink-soft">
            Nothing arrived after a few minutes? Look in the spam folder, then ask for a new link (a few an hour).
          </p>
          <ResendVerificationForm />
        </>
      ) : (
        <>
          <p className="mt-2">
            If the address can be used, a link to confirm it is on its way. Open it to finish creating your account; it
            works once, for 24 hours.
          </p>
          <p className="mt-2 text-sm text-ink-soft">
            Already have an account under that address? Then the e-mail says so instead, and nothing changed.
          </p>
          <p className="mt-4 text-sm">
            Need a new link?{" "}
            <Link href="/sign-in" className="text-brand-700 underline">
              Sign in
            </Link>{" "}
            with the address and password you chose, and ask for one there.
          </p>
        </>
      )}
    </div>
  );
}
