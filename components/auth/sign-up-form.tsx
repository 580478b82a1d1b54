"use client";

import { useActionState } from "react";
import { signUpAction } from "@/lib/auth/sign-up-actions";
import { PASSWORD_MIN } from "@/lib/validation/password-rules";
import type { ActionState } from "@/lib/http/action";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function SignUpForm() {
  const [state, action, pending] = useActionState<ActionState, FormData>(signUpAction, {});
  return (
    <form action={action} aria-label="Create an account" className="mt-6 space-y-4" noValidate aria-busy={pending}>
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
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={String(state.values?.email ?? "")}
        error={state.fieldErrors?.email}
        hint="Your work address: a link to confirm it is sent there."
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN}
        hint={`At least ${PASSWORD_MIN} characters; a short phrase is easier to remember than symbols.`}
        error={state.fieldErrors?.password}
      />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Creating your account…" : "Create account"}
      </button>
    </form>
  );
}
