"use client";

import { useActionState } from "react";
import { updateLabSettingsAction } from "@/app/(lab)/labs/[slug]/settings/actions";
import type { ActionState } from "@/lib/http/action";
import type { LabSettings } from "@/lib/validation/lab-settings";
import { CONTACT_LINE_MAX, LAB_NAME_MAX } from "@/lib/validation/lab-settings";
import { SelectField, TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";

const NUMBER_FORMAT_OPTIONS = [
  { value: "point", label: "Decimal point (3.25 mm)" },
  { value: "comma", label: "Decimal comma (3,25 mm)" },
];

/** The lab's settings for a manager to change; `zones` are the IANA names the server knows. */
export function SettingsForm({ slug, settings, zones }: { slug: string; settings: LabSettings; zones: string[] }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(updateLabSettingsAction, {});
  const value = (key: keyof LabSettings) => String((state.ok ? undefined : state.values?.[key]) ?? settings[key] ?? "");
  return (
    <form action={action} className="grid gap-4" noValidate aria-busy={pending} aria-label="Lab settings">
      <input type="hidden" name="slug" value={slug} />
      <TextField
        label="Lab name"
        name="name"
        required
        maxLength={LAB_NAME_MAX}
        defaultValue={value("name")}
        error={state.fieldErrors?.name}
      />
      <TextField
        label="Time zone"
        name="timeZone"
        list="time-zones"
        autoComplete="off"
        spellCheck={false}
        defaultValue={value("timeZone")}
        hint="An IANA name such as Europe/Berlin. Every date on the lab's pages and e-mails is shown in it."
        error={state.fieldErrors?.timeZone}
      />
      <datalist id="time-zones">
        {zones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
      <SelectField
        label="Numbers on posters"
        name="numberFormat"
        key={value("numberFormat")}
        defaultValue={value("numberFormat")}
        options={NUMBER_FORMAT_OPTIONS}
        error={state.fieldErrors?.numberFormat}
      />
      <TextField
        label="Contact line on the check page"
        name="contactLine"
        maxLength={CONTACT_LINE_MAX}
        defaultValue={value("contactLine")}
        hint="Whom to ask about a printed chart, e.g. “ask the charge nurse in the control room”. Leave empty for none."
        error={state.fieldErrors?.contactLine}
      />
      <div>
        <button type="submit" disabled={pending} className={buttonClass("primary")}>
          {pending ? "Saving…" : "Save settings"}
        </button>
      </div>
      <FormStatus ok={state.ok} message={state.message} />
    </form>
  );
}
