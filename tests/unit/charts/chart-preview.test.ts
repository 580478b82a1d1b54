import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ChartPreview } from "@/components/charts/chart-preview";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, kissingDefinition, potDefinition } from "@/tests/support/poster-fixtures";

const render = (definition: unknown) =>
  renderToStaticMarkup(
    createElement(ChartPreview, {
      definition: chartDefinitionSchema.parse(definition),
      stock: demoStock,
      labName: "Illustrative lab",
      logoSha256: null,
    }),
  )
    .replace(/&#x27;/g, "'")
    .replace(/&quot;/g, '"');

describe("the designer preview says what the guardrails found", () => {
  it("names the stock gap behind oversize cells (4.75 mm is out of stock in the fixture)", () => {
    const html = render(potDefinition);
    expect(html).toContain('data-testid="stock-gaps"');
    expect(html).toMatch(
      /Stocking 4\.75 mm NC \(Illustrative NC balloon\) would remove \d+ oversize cells? from the proximal lookup/,
    );
    expect(html).not.toContain('data-testid="rule-problems"');
  });

  it("says plainly when a chart is mostly outside its law's fit, and which law fits better (Huo et al. 2012)", () => {
    const html = render(kissingDefinition); // square law on near-symmetric kissing diameters
    expect(html).toContain('data-testid="fit-advice"');
    expect(html).toMatch(/outside the published fit of Square \(area-preserving\)/);
    expect(html).toMatch(/For these diameters Huo-Kassab fits better \(0 % outside/);
  });

  it("lists a broken lookup rule", () => {
    const html = render({ ...potDefinition, lookups: [{ ...potDefinition.lookups[0], rounding: "down" }] });
    expect(html).toContain('data-testid="rule-problems"');
    expect(html).toContain('Rule "proximal rounding"');
  });
});
