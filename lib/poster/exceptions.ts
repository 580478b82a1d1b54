// The exceptions in force as the poster and the badge card print them: the rule, what it relaxes,
// who recorded it and why. An exception excuses a chart; the marks it would hide stay on the cells.
import type { AppliedException } from "@/lib/labs/rules";

const EXCEPTION_HEADS: Readonly<Record<string, string>> = {
  law: "Law exception",
  rounding: "Rounding exception",
  caps: "Caps exception",
  exponent: "Exponent exception",
  "no-stent-check": "No-stent-check exception",
  legibility: "Legibility exception",
};

const head = (e: AppliedException) => EXCEPTION_HEADS[e.rule] ?? `Exception to the lab rule “${e.rule}”`;

/** The poster's line, beside the legend. */
export function exceptionLine(e: AppliedException): string {
  const who = e.recordedBy ? `, recorded by ${e.recordedBy}${e.recordedOn ? ` on ${e.recordedOn}` : ""}` : "";
  return `${head(e)}${e.relaxes ? `: ${e.relaxes}` : ""}${who}. Reason: ${e.reason}`;
}

/** The badge card's shorter line: the rule, what it relaxes and why. */
export function cardExceptionLine(e: AppliedException): string {
  return `${head(e)}${e.relaxes ? `: ${e.relaxes}` : ""}. Reason: ${e.reason}`;
}
