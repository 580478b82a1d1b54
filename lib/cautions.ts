// Shown on every poster, the check page and wherever a size is shown (PRODUCT.md, "Cautions").
export const CAUTION_TEXT =
  "Reference aid only. Confirm diameters by imaging; follow the device's own compliance chart, rated burst pressure and stent expansion limits; operator judgement, local protocol and licensed practice rule. The demo data is invented and illustrative.";
