import { describe, expect, it } from "vitest";
import type { Snapshot } from "@/lib/charts/snapshot";
import { exceptionsTouched, fourEyesRefusal, type FourEyesFacts } from "@/lib/editions/four-eyes";
import { potDefinition, snapshotOf } from "../../support/poster-fixtures";

const base = snapshotOf(potDefinition);
// The same chart after a stock change that reaches its cells: one family size less.
const restocked: Snapshot = {
  ...base,
  lookups: base.lookups.map((l, i) =>
    i === 0 && l.family ? { ...l, family: { ...l.family, diameters: l.family.diameters.slice(1) } } : l,
  ),
};

const facts = (over: Partial<FourEyesFacts> = {}): FourEyesFacts => ({
  approverId: 7,
  chartId: 3,
  draft: { createdBy: 1, snapshot: base },
  lastApproved: base,
  chartChanges: [],
  stockChanges: [],
  rulesChanges: [],
  ...over,
});
const stockRow = { action: "stock.balloon.update", detail: { summary: "NC 3.75 mm out of stock" } };

describe("four eyes", () => {
  it("lets someone approve who changed nothing the edition prints", () => {
    expect(fourEyesRefusal(facts())).toBeNull();
  });

  it("refuses the edition's author", () => {
    expect(fourEyesRefusal(facts({ draft: { createdBy: 7, snapshot: base } }))).toMatch(/You drafted this edition/);
  });

  it("refuses whoever changed the chart, naming the change", () => {
    expect(fourEyesRefusal(facts({ chartChanges: [{ action: "chart.updated" }, { action: "chart.logo_set" }] }))).toBe(
      "Since this chart's last approved edition you changed the chart (Changed a chart; Set a chart's logo), so someone else must approve this edition (four eyes).",
    );
  });

  it("counts a stock change only when what the stock gives the chart moved since the last approval", () => {
    expect(fourEyesRefusal(facts({ stockChanges: [stockRow] }))).toBeNull();
    expect(fourEyesRefusal(facts({ stockChanges: [stockRow], draft: { createdBy: 1, snapshot: restocked } }))).toMatch(
      /you changed the lab's stock \(NC 3\.75 mm out of stock\)/,
    );
    // Nothing approved yet: every stock change of theirs counts.
    expect(fourEyesRefusal(facts({ stockChanges: [stockRow], lastApproved: null }))).toMatch(/lab's stock/);
    const many = Array.from({ length: 5 }, (_, i) => ({
      action: "stock.balloon.update",
      detail: { summary: `s${i}` },
    }));
    expect(fourEyesRefusal(facts({ stockChanges: many, lastApproved: null }))).toMatch(/\(s0; s1; s2; and 2 more\)/);
  });

  it("counts an exception recorded, changed or removed for this chart, and no other chart's", () => {
    const mine = { chartId: 3, rule: "law", reason: "Local protocol" };
    const theirs = { chartId: 4, rule: "law", reason: "Other chart" };
    expect(exceptionsTouched({ before: { exceptions: [] }, after: { exceptions: [mine, theirs] } }, 3)).toEqual([
      "law: Local protocol",
    ]);
    expect(exceptionsTouched({ before: { exceptions: [mine] }, after: { exceptions: [] } }, 3)).toEqual([
      "law: Local protocol",
    ]);
    expect(exceptionsTouched({ before: { exceptions: [mine] }, after: { exceptions: [mine, theirs] } }, 3)).toEqual([]);
    expect(exceptionsTouched({ before: { reviewPeriodMonths: 12 }, after: { reviewPeriodMonths: 6 } }, 3)).toEqual([]);
    const refusal = fourEyesRefusal(
      facts({ rulesChanges: [{ detail: { before: {}, after: { exceptions: [mine] } } }] }),
    );
    expect(refusal).toMatch(/you changed the lab rules' exceptions for this chart \(law: Local protocol\)/);
    expect(
      fourEyesRefusal(facts({ rulesChanges: [{ detail: { before: {}, after: { exceptions: [theirs] } } }] })),
    ).toBeNull();
  });

  it("names every door at once", () => {
    const refusal = fourEyesRefusal(
      facts({
        lastApproved: null,
        chartChanges: [{ action: "chart.updated" }],
        stockChanges: [stockRow],
        rulesChanges: [{ detail: { after: { exceptions: [{ chartId: 3, rule: "caps", reason: "r" }] } } }],
      }),
    );
    expect(refusal).toMatch(/the chart \(Changed a chart\), the lab's stock \(.*\), the lab rules' exceptions/);
  });
});
