import { describe, expect, it } from "vitest";
import { CAUTION_TEXT, DEMO_CLAUSE } from "@/lib/cautions";
import { buildSnapshot, type Snapshot } from "@/lib/charts/snapshot";
import { editionPrints, type PrintItem } from "@/lib/editions/prints";
import { posterLegend } from "@/lib/poster/model";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, kissingDefinition, potDefinition, snapshotOf } from "../../support/poster-fixtures";

type Def = Parameters<typeof snapshotOf>[0];
const snap = (def: Def, extra: { ruleExceptions?: { rule: string; reason: string }[]; labIsDemo?: boolean } = {}) =>
  buildSnapshot({
    labName: "Illustrative Cath Lab (demo)",
    definition: chartDefinitionSchema.parse(def),
    stock: demoStock,
    logoSha256: null,
    ...extra,
  });
const byKey = (items: PrintItem[]) => new Map(items.map((i) => [i.key, i]));
const text = (items: PrintItem[], key: string) =>
  byKey(items)
    .get(key as PrintItem["key"])
    ?.lines.join("\n") ?? "";
const changedKeys = (after: Snapshot, before: Snapshot) =>
  editionPrints(after, before)
    .filter((i) => i.changed)
    .map((i) => i.key);

describe("editionPrints", () => {
  it("lists every printed item of a POT chart in the poster's words", () => {
    const s = snap(potDefinition, { labIsDemo: true });
    const items = editionPrints(s, null);
    expect(items.map((i) => i.key)).toEqual([
      "title",
      "law",
      "family:proximal",
      "rounding:proximal",
      "caps",
      "stent",
      "paper",
      "legend",
      "notes",
      "caution",
      "exceptions",
    ]);
    expect(text(items, "law")).toContain("Law: Finet (ratio 0.678): Dp = 0.678 × (Dmb + Dsb)");
    expect(text(items, "law")).toContain("Parameter: ratio 0.678");
    expect(text(items, "law")).toContain("Finet G");
    expect(text(items, "family:proximal")).toMatch(/Illustrative NC balloon: NC, nominal \d+ atm, RBP \d+ atm/);
    expect(text(items, "family:proximal")).toContain("growth at RBP 0.25 mm");
    expect(text(items, "rounding:proximal")).toContain("Balloon rounded up to the next stocked size");
    expect(text(items, "caps")).toContain("more than 0.25 mm above");
    expect(text(items, "caps")).toContain("more than 0.5 mm below");
    expect(text(items, "stent")).toContain("Stent limit: Illustrative DES, checked at RBP");
    expect(text(items, "stent")).toMatch(/Maximum post-dilatation: \d/);
    expect(text(items, "paper")).toContain("Printed on A2 portrait, to be read from 1.5 m.");
    expect(text(items, "paper")).toMatch(/′ of arc at 1\.5 m/);
    expect(byKey(items).get("legend")!.lines).toEqual(posterLegend(s).map((e) => `${e.label}: ${e.text}`));
    expect(text(items, "notes")).toBe(`Notes: ${s.notes}`);
    expect(text(items, "caution")).toBe(`CAUTION. ${CAUTION_TEXT} ${DEMO_CLAUSE}`);
    expect(text(items, "exceptions")).toBe("None: the chart keeps every lab rule");
    expect(items.some((i) => i.changed)).toBe(false);
  });

  it("says what is not printed: no stent platform, no notes, a real lab's caution", () => {
    const items = editionPrints(snap({ ...potDefinition, stentPlatformId: null, notes: "" }), null);
    expect(text(items, "stent")).toBe("Stent limit not checked (no stent platform)");
    expect(text(items, "notes")).toBe("No notes are printed");
    expect(text(items, "caution")).toBe(`CAUTION. ${CAUTION_TEXT}`);
    const side = editionPrints(snap(kissingDefinition), null);
    expect(text(side, "stent")).toBe("No POT lookup: no stent limit is checked");
    expect(text(side, "law")).toContain("Parameter: exponent 2");
  });

  it("gives a reach lookup its headroom line", () => {
    const reach = { ...potDefinition, lookups: [{ ...potDefinition.lookups[0], rounding: "reach" }] };
    const items = editionPrints(snap(reach), null);
    expect(text(items, "headroom:proximal")).toMatch(
      /^Pressures are printed up to the RBP \(\d+ atm\), never above it; a cell whose pressure is within 1 atm below it carries the near-RBP mark/,
    );
  });

  it("prints the exceptions in force with who recorded them; the recorder is not compared", () => {
    const ex = [{ rule: "law", reason: "Local protocol for left main (illustrative)" }];
    const s = snap(potDefinition, { ruleExceptions: ex });
    const items = editionPrints(s, null, { law: "Dr Example Lead" });
    const item = byKey(items).get("exceptions")!;
    expect(item.lines).toEqual(["Exception to the lab rule “law”: Local protocol for left main (illustrative)"]);
    expect(item.notes).toEqual(["“law” recorded by Dr Example Lead"]);
    expect(editionPrints(s, s, { law: "Someone else" }).some((i) => i.changed)).toBe(false);
    expect(changedKeys(s, snap(potDefinition))).toContain("exceptions");
  });

  it("shows a stent exception under the stent platform when none is chosen", () => {
    const s = snap(
      { ...potDefinition, stentPlatformId: null },
      { ruleExceptions: [{ rule: "stent", reason: "Balloon-only lab (illustrative)" }] },
    );
    expect(text(editionPrints(s, null), "stent")).toContain("Exception to the lab rule “stent”: Balloon-only lab");
  });

  it("marks changed exactly the items whose printed words differ", () => {
    const base = snap(potDefinition);
    expect(changedKeys(base, base)).toEqual([]);
    const squared = snap({ ...potDefinition, law: { law: "square" } });
    expect(changedKeys(squared, base)).toContain("law");
    expect(changedKeys(squared, base)).not.toContain("family:proximal");
    const reworded = snap({ ...potDefinition, notes: "Other notes (illustrative)" });
    expect(changedKeys(reworded, base)).toContain("notes");
    expect(changedKeys(reworded, base)).not.toContain("law");
    const capped = snap({ ...potDefinition, roundingCaps: { upMm: 0.5, downMm: 0.5 } });
    expect(changedKeys(capped, base)).toContain("caps");
    // An item the replaced edition did not print counts as changed.
    expect(changedKeys(snap(kissingDefinition), base)).toContain("family:side");
  });
});
