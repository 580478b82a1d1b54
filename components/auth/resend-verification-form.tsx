"use client";

import { useActionState } from "react";
import { resendVerificationAction } from "@/lib/auth/sign-up-actions";
import type { ActionState } from "@/lib/http/action";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function ResendVerificationForm() {
  const [state, action, pending] = useActionState<ActionState, FormData>(resendVerificationAction, {});
  return (
    <form action={action} className="mt-4 space-y-3" aria-busy={pending}>
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("secondary")}>
        {pending ? "Sending…" : "Send a new link"}
      </button>
    </form>
  );
}
