"use client";

import { useActionState, useEffect } from "react";
import { changeEmailAction, changeNameAction, changePasswordAction, leaveLabAction } from "@/app/(lab)/account/actions";
import type { ActionState } from "@/lib/http/action";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { NewPasswordFields } from "@/components/auth/new-password-fields";
import { ACCOUNT_CHANGED_EVENT } from "@/components/shell/header-account";

/** Two forms on the page ask for it: each gets its own id, so each label names its own input. */
function CurrentPassword({ id, error }: { id: string; error?: string }) {
  return (
    <TextField
      id={id}
      label="Current password"
      name="currentPassword"
      type="password"
      autoComplete="current-password"
      required
      error={error}
    />
  );
}

export function NameForm({ name }: { name: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(changeNameAction, {});
  // The header shows the name: tell it to read it again.
  useEffect(() => {
    if (state.ok) window.dispatchEvent(new Event(ACCOUNT_CHANGED_EVENT));
  }, [state]);
  return (
    <form action={action} aria-label="Change your name" className="space-y-3" noValidate aria-busy={pending}>
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        required
        maxLength={120}
        defaultValue={String(state.values?.name ?? name)}
        error={state.fieldErrors?.name}
      />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("secondary")}>
        Save name
      </button>
    </form>
  );
}

export function EmailForm({ email }: { email: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(changeEmailAction, {});
  return (
    <form action={action} aria-label="Change your e-mail address" className="space-y-3" noValidate aria-busy={pending}>
      <p className="text-sm text-ink-soft">
        Now: <strong>{email}</strong>. A new address takes effect when you open the link we send to it.
      </p>
      <TextField
        label="New e-mail address"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={state.ok ? "" : String(state.values?.email ?? "")}
        error={state.fieldErrors?.email}
      />
      <CurrentPassword id="email-current-password" error={state.fieldErrors?.currentPassword} />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("secondary")}>
        Send the link
      </button>
    </form>
  );
}

export function PasswordForm() {
  const [state, action, pending] = useActionState<ActionState, FormData>(changePasswordAction, {});
  return (
    <form action={action} aria-label="Change your password" className="space-y-3" noValidate aria-busy={pending}>
      <CurrentPassword id="password-current-password" error={state.fieldErrors?.currentPassword} />
      <NewPasswordFields errors={state.fieldErrors} />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("secondary")}>
        Change password (signs you out everywhere)
      </button>
    </form>
  );
}

export function LeaveLabButton({ slug, name }: { slug: string; name: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(leaveLabAction, {});
  return (
    <form action={action} className="space-y-2" aria-busy={pending}>
      <input type="hidden" name="slug" value={slug} />
      <button type="submit" disabled={pending} className={buttonClass("secondary", "py-1")}>
        Leave {name}
      </button>
      <FormStatus ok={state.ok} message={state.message} />
    </form>
  );
}
