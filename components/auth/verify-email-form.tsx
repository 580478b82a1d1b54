"use client";

import { useActionState } from "react";
import { verifyEmailAction } from "@/lib/auth/sign-up-actions";
import type { ActionState } from "@/lib/http/action";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function VerifyEmailForm({ token, label }: { token: string; label: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(verifyEmailAction, {});
  return (
    <form action={action} className="mt-4 space-y-3" aria-busy={pending}>
      <input type="hidden" name="token" value={token} />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Confirming…" : label}
      </button>
    </form>
  );
}
