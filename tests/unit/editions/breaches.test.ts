import { describe, expect, it } from "vitest";
import { buildSnapshot } from "@/lib/charts/snapshot";
import { editionBreaches } from "@/lib/editions/breaches";
import { exceptionRecorders } from "@/lib/editions/prints";
import { DEFAULT_LAB_RULES, type LabRules } from "@/lib/labs/rules";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, potDefinition } from "../../support/poster-fixtures";

const CHART = 41;
const snap = (def: object, ruleExceptions?: { rule: string; reason: string }[]) =>
  buildSnapshot({
    labName: "Illustrative Cath Lab (demo)",
    definition: chartDefinitionSchema.parse({ ...potDefinition, ...def }),
    stock: demoStock,
    logoSha256: null,
    ruleExceptions,
  });
const murrayOnly: LabRules = {
  ...DEFAULT_LAB_RULES,
  lookups: { ...DEFAULT_LAB_RULES.lookups, proximal: { ...DEFAULT_LAB_RULES.lookups.proximal, laws: ["murray"] } },
};

describe("editionBreaches", () => {
  it("lists a law the lab does not allow, and nothing once the lead records an exception for this chart", () => {
    const s = snap({});
    expect(editionBreaches(CHART, s, DEFAULT_LAB_RULES)).toEqual([]);
    const b = editionBreaches(CHART, s, murrayOnly);
    expect(b).toHaveLength(1);
    expect(b[0]).toMatchObject({ rule: "law" });
    expect(b[0]!.message).toMatch(/not Finet/);
    const excepted = { ...murrayOnly, exceptions: [{ chartId: CHART, rule: "law" as const, reason: "Illustrative" }] };
    expect(editionBreaches(CHART, s, excepted)).toEqual([]);
    // Another chart's exception waives nothing here.
    const other = { ...murrayOnly, exceptions: [{ chartId: CHART + 1, rule: "law" as const, reason: "Illustrative" }] };
    expect(editionBreaches(CHART, s, other)).toHaveLength(1);
  });

  it("lists figures too small to read at the stated distance as the legibility rule", () => {
    const far = snap({ paper: "A4", readingDistanceM: 4 });
    const b = editionBreaches(CHART, far, DEFAULT_LAB_RULES);
    expect(b.map((x) => x.rule)).toEqual(["legibility"]);
    expect(b[0]!.message).toMatch(/too small to read from 4 m/);
  });
});

describe("exceptionRecorders", () => {
  const ex = (chartId: number, rule: string, reason: string) => ({ chartId, rule, reason });
  it("names who added or last re-worded each of the chart's exceptions", () => {
    const changes = [
      { actorName: "Lead A", before: { exceptions: [] }, after: { exceptions: [ex(CHART, "law", "r1")] } },
      { actorName: "Lead B", before: { reviewPeriodMonths: 12 }, after: { reviewPeriodMonths: 6 } },
      {
        actorName: "Lead B",
        before: { exceptions: [ex(CHART, "law", "r1")] },
        after: { exceptions: [ex(CHART, "law", "r1"), ex(CHART + 1, "caps", "x")] },
      },
      {
        actorName: null,
        before: { exceptions: [ex(CHART, "law", "r1")] },
        after: { exceptions: [ex(CHART, "law", "r1"), ex(CHART, "caps", "r2")] },
      },
    ];
    expect(exceptionRecorders(changes, CHART)).toEqual({ law: "Lead A", caps: "a former member" });
    const reworded = [
      ...changes,
      { actorName: "Lead C", before: changes[3]!.after, after: { exceptions: [ex(CHART, "law", "r3")] } },
    ];
    expect(exceptionRecorders(reworded, CHART).law).toBe("Lead C");
  });
});
