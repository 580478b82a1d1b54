"use client";

import { useActionState } from "react";
import { inviteMemberAction } from "@/app/(lab)/labs/[slug]/members/actions";
import type { ActionState } from "@/lib/http/action";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/permissions";
import { SelectField, TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

const ROLE_HINTS: Record<string, string> = {
  manager: "Stock, rooms, members and invitations; approves editions.",
  lead: "Clinical sign-off: approves or rejects editions.",
  educator: "Designs charts and requests approval.",
  operator: "Reads charts, uses the calculator, records where a copy hangs.",
};

/** `initialRole`: the role a link asked for (a first-run step names the person to invite). */
export function InviteForm({ slug, initialRole = "operator" }: { slug: string; initialRole?: Role }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(inviteMemberAction, {});
  const role = String(state.ok ? initialRole : (state.values?.role ?? initialRole));
  return (
    <form
      action={action}
      className="grid gap-4 sm:grid-cols-[1fr_14rem_auto] sm:items-start"
      noValidate
      aria-busy={pending}
      aria-label="Invite a person"
    >
      <input type="hidden" name="slug" value={slug} />
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="off"
        required
        defaultValue={state.ok ? "" : String(state.values?.email ?? "")}
        error={state.fieldErrors?.email}
      />
      <SelectField
        label="Role"
        name="role"
        key={role}
        defaultValue={role}
        error={state.fieldErrors?.role}
        options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
      />
      <button type="submit" disabled={pending} className={buttonClass("primary", "sm:mt-6")}>
        {pending ? "Sending…" : "Send invitation"}
      </button>
      <FormStatus ok={state.ok} message={state.message} className="sm:col-span-3" />
      <details className="text-sm text-ink-soft sm:col-span-3">
        <summary className="cursor-pointer">What each role may do</summary>
        <ul className="mt-2 list-disc pl-5">
          {ROLES.map((r) => (
            <li key={r}>
              <strong>{ROLE_LABELS[r]}</strong>: {ROLE_HINTS[r]}
            </li>
          ))}
        </ul>
      </details>
    </form>
  );
}
