import "server-only";
import { DEFAULT_LAB_RULES, type LabRules } from "@/lib/labs/rules";

/** The lab's rules (stored per lab from the lab-rules migration on; the defaults until then). */
export async function getLabRules(_: { labId: number }): Promise<LabRules> {
  return DEFAULT_LAB_RULES;
}
