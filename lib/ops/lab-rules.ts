import "server-only";
import * as q from "@/db/queries/lab-rules";
import { labRulesPatchSchema } from "@/lib/labs/rules";
import { labOperation } from "./operation";
import { labWrite } from "./write";

/** The lab's rules, for every member: who may approve and how long an approval lasts. */
export const getLabRules = labOperation({
  name: "lab.rules.get",
  capability: "lab:read",
  scope: "lab",
  run: async ({ labId }) => q.getLabRules({ labId }),
});

/** Changes the lab's rules: the medical lead only; every change audited with before and after. */
export const setLabRules = labOperation({
  name: "lab.rules.set",
  capability: "rules:manage",
  scope: "lab",
  input: labRulesPatchSchema,
  run: async ({ labId, actor }, changes) => {
    const { rules, changed } = await labWrite(labId, (tx) => q.setLabRules(tx, { labId, changes, actor }));
    return { rules, changed };
  },
});
