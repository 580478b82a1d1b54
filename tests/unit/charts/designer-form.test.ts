import { describe, expect, it } from "vitest";
import { errorAt, errorsUnder, lawChoice, mergeCardIssues, nextLookupKind } from "@/lib/charts/designer-form";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { potDefinition } from "@/tests/support/poster-fixtures";

describe("the designer's form helpers", () => {
  it("reads a message at a dotted path and nothing where there is none", () => {
    const errors = { lookups: { 0: { rows: { message: "Rows run backwards" } } } };
    expect(errorAt(errors, "lookups.0.rows")).toBe("Rows run backwards");
    expect(errorAt(errors, "lookups.1.rows")).toBeUndefined();
    expect(errorAt({ title: { message: "" } }, "title")).toBeUndefined();
  });

  it("collects every message under a path, skipping react-hook-form's bookkeeping keys", () => {
    const node = { sides: { 0: { rows: { message: "not an axis value", type: "custom", ref: {} } } } };
    expect(errorsUnder(node, "card")).toEqual([{ path: "card.sides.0.rows", message: "not an axis value" }]);
  });

  it("merges the schema's card problems with the saved ones, without saying one twice", () => {
    const bad = chartDefinitionSchema.safeParse({ ...potDefinition, card: { sides: [{ lookup: 5 }, { lookup: 0 }] } });
    expect(bad.success).toBe(false);
    const issues = bad.success ? [] : bad.error.issues;
    const live = mergeCardIssues(issues, undefined);
    expect(live.length).toBeGreaterThan(0);
    expect(live.every((i) => i.path.startsWith("card"))).toBe(true);
    const saved = { sides: { 0: { lookup: { message: live[0]!.message } } }, other: { message: "from the server" } };
    const merged = mergeCardIssues(issues, saved);
    expect(merged.map((i) => i.message)).toEqual([...live.map((i) => i.message), "from the server"]);
  });

  it("gives each law its default parameter and the next unused lookup kind", () => {
    expect(lawChoice("finet")).toEqual({ law: "finet", ratio: expect.any(Number) });
    expect(lawChoice("power")).toEqual({ law: "power", n: 2.3 });
    expect(lawChoice("murray")).toEqual({ law: "murray" });
    expect(nextLookupKind(["proximal"])).toBe("side");
    expect(nextLookupKind(["proximal", "side", "main"])).toBeNull();
  });
});
