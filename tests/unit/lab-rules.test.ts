import { describe, expect, it } from "vitest";
import {
  checkChartAgainstRules,
  chartDefaults,
  DEFAULT_LAB_RULES,
  labRulesPatchSchema,
  labRulesSchema,
  mergeLabRules,
  readLabRules,
  reviewByDate,
  ruledDefinition,
  ruledSnapshot,
  stampExceptions,
  type LabRules,
  type RuledChart,
} from "@/lib/labs/rules";

const potChart: RuledChart = {
  law: { law: "murray" },
  lookups: [{ kind: "proximal", rounding: "up" }],
  caps: { upMm: 0.25, downMm: 0.5 },
  stentPlatform: true,
};

const strict: LabRules = {
  ...DEFAULT_LAB_RULES,
  lookups: {
    ...DEFAULT_LAB_RULES.lookups,
    proximal: {
      laws: ["finet", "huo-kassab"],
      defaultLaw: { law: "huo-kassab" },
      rounding: ["up"],
      caps: { upMm: 0.25, downMm: 0.25 },
      powerRange: { min: 2, max: 3 },
      rbpHeadroomAtm: 1,
    },
  },
};

describe("lab rules", () => {
  it("reads stored rules over the defaults, kind by kind, and falls back on a broken row", () => {
    expect(readLabRules(null)).toEqual(DEFAULT_LAB_RULES);
    expect(readLabRules({ reviewPeriodMonths: 6 })).toEqual({ ...DEFAULT_LAB_RULES, reviewPeriodMonths: 6 });
    expect(readLabRules({ reviewPeriodMonths: "six" })).toEqual(DEFAULT_LAB_RULES);
    const partial = readLabRules({ lookups: { side: { rounding: ["down"] } } });
    expect(partial.lookups.side).toEqual({ ...DEFAULT_LAB_RULES.lookups.side, rounding: ["down"] });
    expect(partial.lookups.proximal).toEqual(DEFAULT_LAB_RULES.lookups.proximal);
  });

  it("the defaults allow what the clinical guardrails allow, starting from Finet", () => {
    expect(DEFAULT_LAB_RULES.lookups.proximal.rounding).toEqual(["up", "nearest", "reach"]);
    expect(DEFAULT_LAB_RULES.lookups.side.laws).toHaveLength(5);
    expect(checkChartAgainstRules(1, potChart, DEFAULT_LAB_RULES)).toEqual({ issues: [], applied: [] });
  });

  it("refuses unknown keys, wrong types, missing reasons and an empty change, naming the field", () => {
    expect(labRulesPatchSchema.safeParse({ managersMayApprove: true }).success).toBe(true);
    expect(labRulesPatchSchema.safeParse({ lookups: { side: { rounding: ["down"] } }, revision: 3 }).success).toBe(
      true,
    );
    const bad: [unknown, string][] = [
      [{}, ""],
      [{ revision: 2 }, ""],
      [{ other: 1 }, ""],
      [{ reviewPeriodMonths: 0 }, "reviewPeriodMonths"],
      [{ reviewPeriodMonths: 61 }, "reviewPeriodMonths"],
      [{ managersMayApprove: 1 }, "managersMayApprove"],
      [{ lookups: { proximal: { laws: [] } } }, "lookups.proximal.laws"],
      [{ lookups: { proximal: { laws: ["bernoulli"] } } }, "lookups.proximal.laws.0"],
      [
        { lookups: { proximal: { laws: ["murray"], defaultLaw: { law: "finet", ratio: 0.7 } } } },
        "lookups.proximal.defaultLaw",
      ],
      [{ lookups: { side: { rounding: ["up"] } } }, "lookups.side.rounding.0"],
      [{ lookups: { side: { caps: { upMm: 2, downMm: 0.5 } } } }, "lookups.side.caps.upMm"],
      [{ lookups: { side: { caps: { upMm: "0.2", downMm: 0.5 } } } }, "lookups.side.caps.upMm"],
      [{ lookups: { distal: {} } }, "lookups"],
      [{ exceptions: [{ chartId: 4, rule: "law" }] }, "exceptions.0.reason"],
      [{ exceptions: [{ chartId: 4, rule: "law", reason: "  " }] }, "exceptions.0.reason"],
      [{ exceptions: [{ chartId: 4, rule: "speed", reason: "x" }] }, "exceptions.0.rule"],
      [{ exceptions: [{ chartId: "4", rule: "law", reason: "x" }] }, "exceptions.0.chartId"],
      [{ revision: -1, managersMayApprove: true }, "revision"],
    ];
    for (const [body, field] of bad) {
      const r = labRulesPatchSchema.safeParse(body);
      expect(r.success, JSON.stringify(body)).toBe(false);
      if (field)
        expect(
          r.error!.issues.map((i) => i.path.join(".")),
          JSON.stringify(body),
        ).toContain(field);
    }
  });

  it("merges a change kind by kind and checks the whole", () => {
    const merged = mergeLabRules(DEFAULT_LAB_RULES, { lookups: { proximal: { laws: ["murray"] } } });
    // The default (Finet) is no longer allowed: the whole refuses it, naming the default.
    const r = labRulesSchema.safeParse(merged);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(["lookups", "proximal", "defaultLaw"]);
  });

  it("names each rule a chart breaks; an exception waives it and is printed", () => {
    const res = checkChartAgainstRules(7, { ...potChart, caps: { upMm: 0.25, downMm: 0.5 } }, strict);
    expect(res.issues.map((i) => [i.rule, i.path.join(".")])).toEqual([
      ["law", "law"],
      ["caps", "roundingCaps.downMm"],
    ]);
    expect(res.issues[0]!.message).toMatch(/laws allowed.*Finet, Huo-Kassab.*not Murray/);
    const excepted: LabRules = {
      ...strict,
      exceptions: [
        { chartId: 7, rule: "law", reason: "Murray agreed for the teaching chart" },
        { chartId: 7, rule: "rounding", reason: "Not broken, so not printed" },
        { chartId: 7, rule: "legibility", reason: "Hung at the table" },
        { chartId: 8, rule: "caps", reason: "Another chart" },
      ],
    };
    const after = checkChartAgainstRules(7, potChart, excepted);
    expect(after.issues.map((i) => i.rule)).toEqual(["caps"]);
    expect(after.applied).toEqual([
      {
        rule: "law",
        reason: "Murray agreed for the teaching chart",
        relaxes: "Murray for a POT (proximal) lookup; the lab allows Finet, Huo-Kassab",
      },
      {
        rule: "legibility",
        reason: "Hung at the table",
        relaxes: "figures sized for a reader nearer than the stated reading distance",
      },
    ]);
    expect(
      checkChartAgainstRules(
        7,
        { ...potChart, lookups: [{ kind: "proximal", rounding: "nearest" }] },
        strict,
      ).issues.map((i) => i.rule),
    ).toContain("rounding");
  });

  it("an exception keeps who recorded it and when; a new or changed one is stamped, sent stamps ignored", () => {
    const before = [{ chartId: 1, rule: "caps" as const, reason: "Gap", recordedBy: "Ann", recordedOn: "2026-01-02" }];
    const after = stampExceptions(
      before,
      [
        { chartId: 1, rule: "caps", reason: "Gap", recordedBy: "Forged", recordedOn: "1999-01-01" },
        { chartId: 2, rule: "law", reason: "New", recordedBy: "Forged" },
      ],
      "Bea",
      "2026-12-05",
    );
    expect(after).toEqual([
      { chartId: 1, rule: "caps", reason: "Gap", recordedBy: "Ann", recordedOn: "2026-01-02" },
      { chartId: 2, rule: "law", reason: "New", recordedBy: "Bea", recordedOn: "2026-12-05" },
    ]);
  });

  it("a power-law exponent outside the lab's range (default 2 to 3, square to Murray) is a breach an exception excuses", () => {
    const power = (n: number): RuledChart => ({ ...potChart, law: { law: "power", n } });
    expect(DEFAULT_LAB_RULES.lookups.proximal.powerRange).toEqual({ min: 2, max: 3 });
    for (const n of [2, 2.3, 3]) expect(checkChartAgainstRules(1, power(n), DEFAULT_LAB_RULES).issues).toEqual([]);
    const res = checkChartAgainstRules(1, power(1.6), DEFAULT_LAB_RULES);
    expect(res.issues.map((i) => [i.rule, i.path.join(".")])).toEqual([["exponent", "law.n"]]);
    expect(res.issues[0]!.message).toContain("from 2 to 3 in this lab; the chart uses 1.6");
    const waived = checkChartAgainstRules(1, power(3.2), {
      ...DEFAULT_LAB_RULES,
      exceptions: [{ chartId: 1, rule: "exponent", reason: "Teaching chart" }],
    });
    expect(waived.issues).toEqual([]);
    expect(waived.applied[0]!.relaxes).toBe(
      "power-law exponent n = 3.2 (the lab's range for a POT (proximal) lookup: 2 to 3)",
    );
    const bad = labRulesPatchSchema.safeParse({ lookups: { proximal: { powerRange: { min: 2.5, max: 2.2 } } } });
    expect(bad.error!.issues.map((i) => i.path.join("."))).toContain("lookups.proximal.powerRange.max");
    const wide = labRulesPatchSchema.safeParse({ lookups: { proximal: { powerRange: { min: 1, max: 3 } } } });
    expect(wide.error!.issues.map((i) => i.path.join("."))).toContain("lookups.proximal.powerRange.min");
  });

  it("a POT lookup without a stent platform breaks the rule unless a no-stent-check exception is recorded", () => {
    const bare: RuledChart = { ...potChart, stentPlatform: false };
    const res = checkChartAgainstRules(3, bare, DEFAULT_LAB_RULES);
    expect(res.issues.map((i) => [i.rule, i.path.join(".")])).toEqual([["no-stent-check", "stentPlatformId"]]);
    // Side and main lookups check no stent.
    const side: RuledChart = { ...bare, lookups: [{ kind: "side", rounding: "down" }] };
    expect(checkChartAgainstRules(3, side, DEFAULT_LAB_RULES).issues).toEqual([]);
    const excused = checkChartAgainstRules(3, bare, {
      ...DEFAULT_LAB_RULES,
      exceptions: [{ chartId: 3, rule: "no-stent-check", reason: "No DES used in this room (illustrative)" }],
    });
    expect(excused.issues).toEqual([]);
    expect(excused.applied).toEqual([
      {
        rule: "no-stent-check",
        reason: "No DES used in this room (illustrative)",
        relaxes: "POT balloons are not checked against any stent's maximum post-dilatation diameter",
      },
    ]);
    expect(ruledDefinition({ ...bare, stentPlatformId: 4 }).stentPlatform).toBe(true);
    expect(ruledSnapshot({ ...bare, stent: null }).stentPlatform).toBe(false);
  });

  it("new charts start from the lab's default law, an allowed rounding and its caps", () => {
    expect(chartDefaults(strict, "proximal")).toEqual({
      law: { law: "huo-kassab" },
      rounding: "up",
      roundingCaps: { upMm: 0.25, downMm: 0.25 },
    });
    const noDown: LabRules = {
      ...strict,
      lookups: { ...strict.lookups, side: { ...strict.lookups.side, rounding: ["nearest"] } },
    };
    expect(chartDefaults(noDown, "side").rounding).toBe("nearest");
  });

  it("puts the review-by date the period later, clamped to the end of a shorter month", () => {
    expect(reviewByDate(new Date("2026-03-15T10:00:00Z"), 12).toISOString()).toBe("2027-03-15T10:00:00.000Z");
    expect(reviewByDate(new Date("2026-01-31T10:00:00Z"), 1).toISOString()).toBe("2026-02-28T10:00:00.000Z");
    expect(reviewByDate(new Date("2027-11-30T00:00:00Z"), 3).toISOString()).toBe("2028-02-29T00:00:00.000Z");
  });
});
