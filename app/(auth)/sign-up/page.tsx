import Link from "next/link";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { env } from "@/lib/env";
import { INVITE_ONLY_MESSAGE } from "@/lib/ops/sign-up";

export const metadata = { title: "Create an account" };

export default function SignUpPage() {
  const open = env.SIGNUP === "open";
  return (
    <div>
      <h1 className="text-2xl font-bold">Create an account</h1>
      {open ? (
        <>
          <p className="mt-1 text-sm text-ink-soft">
            For the person who sets up a lab on Forkwall. Joining a lab that already uses it? Open the invitation its
            manager sent you instead.
          </p>
          <SignUpForm />
        </>
      ) : (
        <p className="mt-4 rounded-md border border-line bg-paper-sunk px-3 py-2 text-sm" data-testid="invite-only">
          {INVITE_ONLY_MESSAGE} Ask your lab&apos;s manager to invite you; the e-mail they send holds a link that
          creates your account.
        </p>
      )}
      <p className="mt-6 text-sm">
        Already have an account?{" "}
        <Link href="/sign-in" className="text-brand-700 underline">
          Sign in
        </Link>
      </p>
    </div>
  );
}
