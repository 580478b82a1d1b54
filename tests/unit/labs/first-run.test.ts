import { describe, expect, it } from "vitest";
import { firstRunSteps, SIZE_LADDER, type FirstRunStatus } from "@/lib/labs/first-run";
import { ladderFamilySchema } from "@/lib/validation/ladder";
import { createLabSchema, RESERVED_SLUGS, suggestSlug } from "@/lib/validation/lab";

const empty: FirstRunStatus = {
  familiesWithStock: 0,
  sizesInStock: 0,
  members: { lead: 0, educator: 0 },
  invited: { lead: 0, educator: 0 },
  charts: 0,
  approvedEditions: 0,
};

describe("the generic size ladder", () => {
  it("is 1.50 to 5.00 mm in 0.25 mm steps, diameters only", () => {
    expect(SIZE_LADDER).toHaveLength(15);
    expect(SIZE_LADDER[0]).toBe(1.5);
    expect(SIZE_LADDER.at(-1)).toBe(5);
    expect(SIZE_LADDER.slice(1).map((d, i) => Math.round((d - SIZE_LADDER[i]!) * 100))).toEqual(Array(14).fill(25));
  });

  it("refuses a family without the manager's pressures, naming each field (no default pressure exists)", () => {
    const parsed = ladderFamilySchema.safeParse({ name: "NC ladder", compliance: "nc", diameters: [...SIZE_LADDER] });
    expect(parsed.success).toBe(false);
    const paths = parsed.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["nominalAtm", "rbpAtm"]));
    expect(parsed.error!.issues.find((i) => i.path[0] === "nominalAtm")!.message).toBe("Nominal pressure is required.");
  });

  it("accepts typed pressures and ticked ladder diameters only", () => {
    const ok = ladderFamilySchema.parse({
      name: "NC ladder",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      diameters: [2, 2.25],
    });
    expect(ok.growthAtRbpMm).toBeNull();
    const off = ladderFamilySchema.safeParse({
      name: "x",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      diameters: [2.1],
    });
    expect(off.error?.issues[0]?.path).toEqual(["diameters"]);
    const none = ladderFamilySchema.safeParse({
      name: "x",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      diameters: [],
    });
    expect(none.error?.issues[0]?.path).toEqual(["diameters"]);
    const order = ladderFamilySchema.safeParse({
      name: "x",
      compliance: "nc",
      nominalAtm: 20,
      rbpAtm: 12,
      diameters: [2],
    });
    expect(order.error?.issues[0]?.path).toEqual(["rbpAtm"]);
  });
});

describe("first-run steps", () => {
  it("an empty lab: every step to do, each saying what is missing and linking to it", () => {
    const steps = firstRunSteps("north", empty);
    expect(steps.map((s) => s.key)).toEqual(["stock", "lead", "educator", "chart", "approved"]);
    expect(steps.every((s) => !s.done && s.links.length > 0)).toBe(true);
    expect(steps[0]!.state).toMatch(/No balloon sizes in stock/);
    expect(steps[0]!.links.map((l) => l.href)).toEqual([
      "/labs/north/stock#stock-import-heading",
      "/labs/north/stock/ladder",
    ]);
    expect(steps[3]!.links.map((l) => l.href)).toEqual([
      "/labs/north/charts/new?template=pot",
      "/labs/north/charts/new?template=kissing",
    ]);
  });

  it("ticks steps as the lab fills; an open invitation is not yet a member", () => {
    const steps = firstRunSteps("north", {
      ...empty,
      familiesWithStock: 1,
      sizesInStock: 15,
      invited: { lead: 1, educator: 0 },
      members: { lead: 0, educator: 1 },
    });
    const by = Object.fromEntries(steps.map((s) => [s.key, s]));
    expect(by.stock).toMatchObject({ done: true, state: "15 balloon sizes in stock in 1 family." });
    expect(by.lead).toMatchObject({ done: false });
    expect(by.lead!.state).toMatch(/Invited, waiting/);
    expect(by.educator!.done).toBe(true);
    expect(by.chart!.done).toBe(false);
  });
});

describe("lab slugs (the one schema for API, form and CLI)", () => {
  it("keeps the rules: 3-48 lower-case letters, digits, hyphens; reserved words refused", () => {
    const ok = (slug: string) => createLabSchema.safeParse({ name: "A lab", slug }).success;
    expect(ok("abc")).toBe(true);
    expect(ok("a".repeat(48))).toBe(true);
    expect(ok("a".repeat(49))).toBe(false);
    expect(ok("ab")).toBe(false);
    expect(ok("Abc")).toBe(false);
    for (const word of ["new", "api", "admin", "settings"]) expect(RESERVED_SLUGS.has(word) && !ok(word)).toBe(true);
    for (const name of ["North Cath Lab", "Ünï Lab 2", "New", "X", "Labor & Delivery — Cath"]) {
      const s = suggestSlug(name);
      if (s) expect(ok(s), `${name} -> ${s}`).toBe(true);
    }
  });
});
