import Link from "next/link";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { FormStatus } from "@/components/ui/form-status";
import { readResetLink } from "@/lib/ops/accounts";

export const metadata = { title: "Choose a new password" };

const PROBLEMS = {
  missing: "This reset link is not valid. Check that you copied the whole link, or ask for a new one.",
  expired: "This reset link has expired. Ask for a new one.",
  used: "This reset link has already been used. Ask for a new one if you still need it.",
  revoked: "This reset link is no longer valid. Ask for a new one.",
} as const;

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const reset = await readResetLink({ token });
  const problem = !reset ? "missing" : reset.state === "valid" ? null : reset.state;
  return (
    <div>
      <h1 className="text-2xl font-bold">Choose a new password</h1>
      {problem ? (
        <>
          <FormStatus message={PROBLEMS[problem]} className="mt-4" />
          <p className="mt-6 text-sm">
            <Link href="/forgot-password" className="text-brand-700 underline">
              Ask for a new link
            </Link>
          </p>
        </>
      ) : (
        <>
          <p className="mt-1 text-sm text-ink-soft">
            For <strong>{reset!.email}</strong>. After this, every other reset link for the account stops working.
          </p>
          <ResetPasswordForm token={token} email={reset!.email} />
        </>
      )}
    </div>
  );
}
