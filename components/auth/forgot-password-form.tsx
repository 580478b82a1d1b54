"use client";

import { useActionState } from "react";
import { requestPasswordResetAction } from "@/lib/auth/actions";
import type { ActionState } from "@/lib/http/action";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function ForgotPasswordForm() {
  const [state, action, pending] = useActionState<ActionState, FormData>(requestPasswordResetAction, {});
  return (
    <form action={action} className="mt-6 space-y-4" noValidate aria-busy={pending}>
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={String(state.values?.email ?? "")}
        error={state.fieldErrors?.email}
      />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Sending…" : "Send the link"}
      </button>
    </form>
  );
}
