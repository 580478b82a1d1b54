"use client";

import { useActionState } from "react";
import { acceptInvitationAction } from "@/lib/auth/actions";
import type { ActionState } from "@/lib/http/action";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { NewPasswordFields } from "./new-password-fields";

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(acceptInvitationAction, {});
  return (
    <form action={action} className="mt-4 space-y-4" noValidate aria-busy={pending}>
      <input type="hidden" name="token" value={token} />
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        required
        maxLength={120}
        defaultValue={String(state.values?.name ?? "")}
        error={state.fieldErrors?.name}
        hint="As colleagues know you, e.g. Dr A. Rivera."
      />
      <NewPasswordFields errors={state.fieldErrors} />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Creating your account…" : "Create account and join"}
      </button>
    </form>
  );
}
