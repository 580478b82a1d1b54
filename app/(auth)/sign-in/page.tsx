import Link from "next/link";
import { SignInForm } from "@/components/auth/sign-in-form";
import { FormStatus } from "@/components/ui/form-status";
import { signInNotice } from "@/lib/auth/sign-in-notice";
import { currentUser } from "@/lib/auth/session";
import { env } from "@/lib/env";

export const metadata = { title: "Sign in" };

type Search = {
  callbackUrl?: string;
  error?: string;
  code?: string;
  signedOut?: string;
  reset?: string;
  notice?: string;
  email?: string;
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Search> }) {
  const q = await searchParams;
  const safe =
    q.callbackUrl &&
    q.callbackUrl.startsWith("/") &&
    !q.callbackUrl.startsWith("//") &&
    !q.callbackUrl.startsWith("/\\")
      ? q.callbackUrl
      : "/dashboard";
  const user = await currentUser().catch(() => null);
  const n = signInNotice(q, env.SIGNIN_THROTTLE_SECONDS);
  return (
    <div>
      <h1 className="text-2xl font-bold">Sign in</h1>
      <p className="mt-1 text-sm text-ink-soft">Use the e-mail address of your Forkwall account.</p>
      {user ? (
        <p className="mt-4 rounded-md border border-line bg-paper-sunk px-3 py-2 text-sm">
          You are signed in as <strong>{user.email}</strong>.{" "}
          <Link href="/dashboard" className="inline-flex min-h-11 items-center text-brand-700 underline">
            Go to your labs
          </Link>{" "}
          or sign in below as someone else.
        </p>
      ) : null}
      {n ? <FormStatus ok={n.ok} message={n.message} className="mt-4" /> : null}
      <SignInForm callbackUrl={safe} email={q.email} />
      <p className="mt-6 text-sm">
        <Link href="/forgot-password" className="inline-flex min-h-11 items-center text-brand-700 underline">
          Forgot your password?
        </Link>
      </p>
      <p className="mt-2 text-sm text-ink-soft">
        {env.SIGNUP === "open" ? (
          <>
            No account? Joining a lab: open the invitation its manager sent you. Setting up a new lab:{" "}
            <Link href="/sign-up" className="inline-flex min-h-11 items-center text-brand-700 underline">
              create an account
            </Link>
            .
          </>
        ) : (
          "No account? Forkwall accounts are created from an invitation sent by a lab manager."
        )}
      </p>
    </div>
  );
}
