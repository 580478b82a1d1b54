// Shown on every poster, the check page and wherever a size is shown. The demo clause belongs
// only to labs flagged as demo (labs.is_demo): a real lab's poster never calls its data invented.
export const CAUTION_TEXT =
  "Reference aid only. Confirm diameters by imaging; follow the device's own compliance chart, rated burst pressure and stent expansion limits; operator judgement, local protocol and licensed practice rule.";

export const DEMO_CLAUSE = "The demo data is invented and illustrative.";

export function cautionFor(isDemo: boolean): string {
  return isDemo ? `${CAUTION_TEXT} ${DEMO_CLAUSE}` : CAUTION_TEXT;
}
