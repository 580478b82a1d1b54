"use client";

import { useActionState, useState } from "react";
import { createLabAction } from "@/app/(lab)/labs/new/actions";
import type { ActionState } from "@/lib/http/action";
import { createLabSchema, SLUG_MAX, suggestSlug } from "@/lib/validation/lab";
import { TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

/** Checks the fields with the API's own schema before sending; the server checks again. */
function localErrors(name: string, slug: string): Record<string, string> {
  const parsed = createLabSchema.safeParse({ name, slug });
  if (parsed.success) return {};
  const out: Record<string, string> = {};
  for (const i of parsed.error.issues) out[String(i.path[0])] ??= i.message;
  return out;
}

export function NewLabForm({ origin }: { origin: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(createLabAction, {});
  const [name, setName] = useState(String(state.values?.name ?? ""));
  const [slug, setSlug] = useState(String(state.values?.slug ?? ""));
  const [slugEdited, setSlugEdited] = useState(Boolean(state.values?.slug));
  const [checked, setChecked] = useState<Record<string, string> | null>(null);
  const errors = { ...(checked ?? {}), ...(state.fieldErrors ?? {}) };
  const shownSlug = slugEdited ? slug : suggestSlug(name);
  return (
    <form
      action={action}
      aria-label="Create a lab"
      className="mt-6 max-w-xl space-y-4"
      noValidate
      aria-busy={pending}
      onSubmit={(e) => {
        const found = localErrors(name, shownSlug);
        setChecked(found);
        if (Object.keys(found).length) e.preventDefault();
      }}
    >
      <TextField
        label="Lab name"
        name="name"
        required
        maxLength={160}
        value={name}
        onChange={(e) => setName(e.target.value)}
        error={errors.name}
        hint="As your team says it, e.g. North Hospital Cath Lab."
      />
      <TextField
        label="Address (slug)"
        name="slug"
        required
        maxLength={SLUG_MAX}
        value={shownSlug}
        onChange={(e) => {
          setSlugEdited(true);
          setSlug(e.target.value);
        }}
        error={errors.slug}
        hint={
          <>
            Lower-case letters, digits and hyphens, 3-{SLUG_MAX} characters. The lab will live at {origin}/labs/
            <strong>{shownSlug || "…"}</strong>; it cannot be changed later.
          </>
        }
      />
      <FormStatus ok={state.ok} message={state.message} />
      <button type="submit" disabled={pending} className={buttonClass("primary")}>
        {pending ? "Creating…" : "Create the lab"}
      </button>
    </form>
  );
}
