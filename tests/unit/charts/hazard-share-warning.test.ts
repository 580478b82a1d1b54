import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { HazardShareWarning } from "@/components/charts/hazard-share-warning";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, kissingDefinition, potDefinition } from "@/tests/support/poster-fixtures";

const render = (definition: unknown) =>
  renderToStaticMarkup(
    createElement(HazardShareWarning, { definition: chartDefinitionSchema.parse(definition), stock: demoStock }),
  ).replace(/&#x27;/g, "'");

describe("the designer's stent-limit share warning", () => {
  it("says how many sized cells are marked and names a change that marks fewer", () => {
    const html = render(potDefinition);
    expect(html).toContain('data-testid="hazard-share"');
    expect(html).toMatch(/\d+ of \d+ sized cells of the proximal lookup carry the stent-limit mark/);
    expect(html).toMatch(/<li>A [\d.]+ mm stent that post-dilates to [\d.]+ mm/);
  });

  it("shows nothing for a chart without the mark", () => {
    expect(render(kissingDefinition)).toBe("");
  });
});
