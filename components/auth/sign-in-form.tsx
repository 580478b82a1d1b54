"use client";

import { useActionState } from "react";
import { signInAction } from "@/lib/auth/actions";
import type { ActionState } from "@/lib/http/action";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function SignInForm({ callbackUrl, email }: { callbackUrl: string; email?: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(signInAction, {});
  return (
    <form action={action} className="mt-6 space-y-4" noValidate aria-busy={pending}>
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      <TextField
        label="E-mail"
        name="email"
        id="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={String(state.values?.email ?? email ?? "")}
      />
      <TextField
        label="Password"
        name="password"
        id="password"
        type="password"
        autoComplete="current-password"
        required
      />
      <FormStatus message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
