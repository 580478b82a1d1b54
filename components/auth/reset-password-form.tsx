"use client";

import { useActionState } from "react";
import { resetPasswordAction } from "@/lib/auth/actions";
import type { ActionState } from "@/lib/http/action";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { NewPasswordFields } from "./new-password-fields";

export function ResetPasswordForm({ token, email }: { token: string; email: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(resetPasswordAction, {});
  return (
    <form action={action} className="mt-6 space-y-4" noValidate aria-busy={pending}>
      <input type="hidden" name="token" value={token} />
      {/* Lets password managers file the new password under the right account. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <NewPasswordFields errors={state.fieldErrors} />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Saving…" : "Save the new password"}
      </button>
    </form>
  );
}
