"use client";

import { useActionState } from "react";
import { joinLabAction } from "@/lib/auth/actions";
import type { ActionState } from "@/lib/http/action";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

export function JoinLabForm({ token, labName, role }: { token: string; labName: string; role: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(joinLabAction, {});
  return (
    <form action={action} className="mt-6 space-y-4" aria-busy={pending}>
      <input type="hidden" name="token" value={token} />
      <p className="text-ink-soft">
        You are signed in with the invited address. Join {labName} as {role.toLowerCase()}?
      </p>
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary")}>
        {pending ? "Joining…" : `Join ${labName}`}
      </button>
    </form>
  );
}
