// Which rounding rule and balloon family each lookup may use (common practice): a POT balloon is
// non-compliant and rounds up, to the nearest size or reaches by pressure; side- and main-branch
// balloons round down or to the nearest size; reach-by-pressure needs recorded growth. These are
// the guardrails: a lab's own rules and its lead's exceptions (lib/labs/rules.ts) choose within them.
import { AppError, type FieldIssue } from "@/lib/errors";
import { hasGrowthData, type LookupKind, type RoundingRule } from "@/lib/sizing";
import type { ChartDefinition } from "@/lib/validation/chart";
import type { LabStock } from "./snapshot";

export const ALLOWED_ROUNDING: Readonly<Record<LookupKind, readonly RoundingRule[]>> = {
  proximal: ["up", "nearest", "reach"],
  side: ["down", "nearest"],
  main: ["nearest", "down"],
};

const KIND_WORDS: Readonly<Record<LookupKind, string>> = {
  proximal: "A POT (proximal) lookup",
  side: "A side-branch lookup",
  main: "A main-branch lookup",
};

/** Every lookup rule the definition breaks against this stock, each with the field it concerns. */
export function chartRuleIssues(definition: ChartDefinition, stock: LabStock): FieldIssue[] {
  const issues: FieldIssue[] = [];
  definition.lookups.forEach((l, i) => {
    const allowed = ALLOWED_ROUNDING[l.kind];
    if (!allowed.includes(l.rounding)) {
      issues.push({
        path: ["lookups", i, "rounding"],
        message: `Rule "${l.kind} rounding": ${KIND_WORDS[l.kind]} rounds ${allowed.join(", ")} (common practice), not ${l.rounding}`,
      });
    }
    const family = stock.balloonFamilies.find((f) => f.id === l.familyId);
    if (!family) return; // a missing family is reported when an edition is made
    if (l.kind === "proximal" && family.compliance !== "nc") {
      issues.push({
        path: ["lookups", i, "familyId"],
        message: `Rule "proximal family": a POT balloon must be non-compliant; ${family.name} is semi-compliant`,
      });
    }
    if (l.rounding === "reach" && !hasGrowthData({ ...family, diameters: [] })) {
      issues.push({
        path: ["lookups", i, "rounding"],
        message: `Rule "reach needs growth": ${family.name} records no growth at rated burst pressure, so no pressure can be printed`,
      });
    }
  });
  return issues;
}

/** Refuses (400, naming the rule and field) a definition that breaks a lookup rule. */
export function assertChartRules(definition: ChartDefinition, stock: LabStock): void {
  const issues = chartRuleIssues(definition, stock);
  if (issues.length === 0) return;
  const first = issues[0]!;
  throw new AppError(
    "invalid_input",
    issues.length === 1
      ? `${first.path.join(".")}: ${first.message}`
      : `${issues.length} rule problems; first, ${first.path.join(".")}: ${first.message}`,
    issues,
  );
}
