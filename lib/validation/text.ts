import { z } from "zod";

// The one schema for text people type (names, titles, notes, reasons): whatever arrives is
// stored and printed on posters, so it must be well-formed and visible.
// - Lone UTF-16 surrogates (valid in JSON, not in UTF-8) are refused: MariaDB cannot store them.
// - Unicode NFC normalisation (UAX #15), so "é" typed two ways is one name.
// - C0 and C1 control characters (NUL included) are refused; multi-line fields keep line breaks.
// - Bidirectional embeddings, overrides and isolates (U+202A-U+202E, U+2066-U+2069; UAX #9)
//   are refused: they can make printed text read differently from what was stored.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;
const LINE_BREAK_OR_TAB = /[\t\n]/;
const BIDI_CONTROL = /[\u202A-\u202E\u2066-\u2069]/;

export type FreeTextOptions = {
  /** What the field is, for messages ("Title", "Room name"). */
  what: string;
  max: number;
  min?: number;
  multiline?: boolean;
  requiredMessage?: string;
  minMessage?: string;
  maxMessage?: string;
};

/** Checks and normalises one free-text field (see the rules above). */
export function freeText(o: FreeTextOptions) {
  const min = o.min ?? 0;
  return z
    .string({ error: o.requiredMessage ?? `${o.what} must be text.` })
    .refine((s) => !LONE_SURROGATE.test(s), `${o.what} contains a broken character (a lone surrogate).`)
    .overwrite((s) => s.replace(/\r\n?/g, "\n").normalize("NFC").trim())
    .refine(
      (s) => !CONTROL.test(s) && (o.multiline || !LINE_BREAK_OR_TAB.test(s)),
      o.multiline
        ? `${o.what} cannot contain control characters.`
        : `${o.what} cannot contain line breaks or control characters.`,
    )
    .refine((s) => !BIDI_CONTROL.test(s), `${o.what} cannot contain text-direction override characters.`)
    .min(
      min,
      o.minMessage ??
        (min === 1 ? `Enter the ${o.what.toLowerCase()}.` : `${o.what} needs at least ${min} characters.`),
    )
    .max(o.max, o.maxMessage ?? `${o.what} must be ${o.max} characters or fewer.`);
}
