import { z } from "zod";
import { isTimeZone } from "@/lib/format/dates";
import { LAB_NAME_MAX, labNameField } from "./lab";
import { freeText } from "./text";

export const NUMBER_FORMATS = ["point", "comma"] as const;
export type NumberFormat = (typeof NUMBER_FORMATS)[number];

export { LAB_NAME_MAX };
export const CONTACT_LINE_MAX = 200;

/** What a lab's settings read as, for every member. */
export type LabSettings = {
  name: string;
  timeZone: string;
  numberFormat: NumberFormat;
  contactLine: string | null;
  /** Set only by the seed: demo labs print the "invented and illustrative" clause. */
  isDemo: boolean;
};

/**
 * A change to some of the settings (API and form): unknown keys are refused, so a typo never
 * reads as "nothing to change". An empty contact line clears it.
 */
const settingsShape = z
  .object({
    name: labNameField,
    timeZone: z
      .string({ error: "Time zone must be text." })
      // Not free text: an exact IANA name from the runtime's time-zone database.
      .refine(isTimeZone, "Time zone must be an IANA time-zone name such as Europe/Berlin or UTC."),
    numberFormat: z.enum(NUMBER_FORMATS, { error: 'Number format must be "point" or "comma".' }),
    contactLine: z
      .union([freeText({ what: "Contact line", max: CONTACT_LINE_MAX }), z.null()], {
        error: "Contact line must be text or null.",
      })
      .transform((v) => (v === "" ? null : v)),
    isDemo: z.never({ error: "The demo flag is set only by the seed and cannot be changed." }),
  })
  .partial();
const KNOWN = new Set(Object.keys(settingsShape.shape));

export const labSettingsPatch = settingsShape.loose().superRefine((value, ctx) => {
  // Each unknown key is its own issue with the key as its path, so the 400 names it.
  for (const key of Object.keys(value))
    if (!KNOWN.has(key))
      ctx.addIssue({
        code: "custom",
        path: [key],
        message: `Unknown setting "${key}": the settings are name, timeZone, numberFormat and contactLine.`,
      });
});

export type LabSettingsPatch = Omit<z.infer<typeof settingsShape>, "isDemo">;
