import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <div>
      <h1 className="text-2xl font-bold">Reset your password</h1>
      <p className="mt-1 text-sm text-ink-soft">
        Enter the e-mail address you sign in with. If it belongs to an account, we will send a link to choose a new
        password.
      </p>
      <ForgotPasswordForm />
      <p className="mt-6 text-sm">
        <Link href="/sign-in" className="text-brand-700 underline">
          Back to sign-in
        </Link>
      </p>
    </div>
  );
}
