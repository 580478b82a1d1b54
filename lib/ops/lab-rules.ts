import "server-only";
import * as q from "@/db/queries/lab-rules";
import { labRulesPatchSchema } from "@/lib/labs/rules";
import { whatIfLabWrite } from "./impact";
import { labOperation } from "./operation";
import { labWrite } from "./write";

/** The lab's rules and their revision, for every member. */
export const getLabRules = labOperation({
  name: "lab.rules.get",
  capability: "lab:read",
  scope: "lab",
  run: async ({ labId }) => {
    const { rules, revision } = await q.getLabRulesWithRevision({ labId });
    return { ...rules, revision };
  },
});

/**
 * Changes the lab's rules: the medical lead only; a stale `revision` is 409; every change
 * audited with before and after.
 */
export const setLabRules = labOperation({
  name: "lab.rules.set",
  capability: "rules:manage",
  scope: "lab",
  input: labRulesPatchSchema,
  run: async ({ labId, actor }, changes) => {
    const { rules, revision, changed } = await labWrite(labId, (tx) => q.setLabRules(tx, { labId, changes, actor }));
    return { rules, revision, changed };
  },
});

/** The posted copies a change to the rules would make outdated; writes nothing. */
export const labRulesImpact = labOperation({
  name: "lab.rules.impact",
  capability: "rules:manage",
  scope: "lab",
  input: labRulesPatchSchema,
  run: async ({ labId, actor }, changes) => ({
    outdates: await whatIfLabWrite(labId, (tx) => q.setLabRules(tx, { labId, changes, actor })),
  }),
});
