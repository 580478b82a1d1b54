import { createElement, type ReactNode } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { useForm, type UseFormReturn } from "react-hook-form";
import { describe, expect, it } from "vitest";
import { LawFields } from "@/components/charts/designer/law-fields";
import { LookupFieldset } from "@/components/charts/designer/lookup-fieldset";
import { PrintFields, StentField } from "@/components/charts/designer/print-fields";
import { SaveNotice } from "@/components/charts/designer/save-notice";
import { chartDefinitionSchema, type ChartDefinition } from "@/lib/validation/chart";
import { demoStock, potDefinition } from "@/tests/support/poster-fixtures";

const initial = chartDefinitionSchema.parse(potDefinition);

/** Renders a part inside a real react-hook-form form holding `values`. */
function render(part: (form: UseFormReturn<ChartDefinition>) => ReactNode, values: ChartDefinition = initial) {
  function Host() {
    const form = useForm<ChartDefinition>({ defaultValues: values });
    return createElement("form", null, part(form));
  }
  return renderToStaticMarkup(createElement(Host));
}

describe("the designer's parts", () => {
  it("law fields show Finet's ratio only for Finet and the exponent only for the power law", () => {
    const finet = render((form) => createElement(LawFields, { form, law: "finet" }));
    expect(finet).toContain('id="ratio"');
    expect(finet).not.toContain('id="n"');
    const power = render((form) => createElement(LawFields, { form, law: "power" }));
    expect(power).toContain('id="n"');
    expect(power).not.toContain('id="ratio"');
  });

  it("a lookup lists the lab's families, disables kinds used elsewhere and offers removal only when asked", () => {
    const html = render((form) =>
      createElement(LookupFieldset, {
        form,
        index: 0,
        kind: "proximal",
        usedKinds: new Set(["proximal", "side"] as const),
        families: demoStock.balloonFamilies,
      }),
    );
    for (const fam of demoStock.balloonFamilies) expect(html).toContain(fam.name);
    expect(html).toMatch(/<option value="side" disabled="">/);
    expect(html).not.toMatch(/<option value="proximal" disabled/);
    expect(html).not.toContain("Remove lookup 1");
    const removable = render((form) =>
      createElement(LookupFieldset, {
        form,
        index: 1,
        kind: "side",
        usedKinds: new Set(["side"] as const),
        families: [],
        onRemove: () => {},
      }),
    );
    expect(removable).toContain("Remove lookup 2");
    expect(removable).toContain("No balloon families in stock");
  });

  it("the stent field selects the chosen platform; print fields carry the caps' caution", () => {
    const platform = demoStock.stentPlatforms[0]!;
    const stent = render((form) =>
      createElement(StentField, { form, platforms: demoStock.stentPlatforms, value: platform.id }),
    );
    expect(stent).toContain(`<option value="${platform.id}" selected="">${platform.name}</option>`);
    const print = render((form) => createElement(PrintFields, { form }));
    expect(print).toContain('id="distance"');
    expect(print).toContain("common practice, no published source");
  });

  it("the save notice is a status when saved and an alert when refused", () => {
    expect(renderToStaticMarkup(createElement(SaveNotice, { notice: { ok: true, text: "Saved." } }))).toContain(
      'role="status"',
    );
    expect(renderToStaticMarkup(createElement(SaveNotice, { notice: { ok: false, text: "No." } }))).toContain(
      'role="alert"',
    );
    expect(renderToStaticMarkup(createElement(SaveNotice, { notice: null }))).toBe("");
  });
});
