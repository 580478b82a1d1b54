import { api } from "@/lib/http/route";
import { getLabRules, setLabRules } from "@/lib/ops/lab-rules";

export const GET = api<{ slug: string }>(({ caller, params }) => getLabRules(caller, { lab: params.slug }));

// PUT takes some or all of the rules; the ones not named keep their value.
export const PUT = api<{ slug: string }>(async ({ caller, params, body }) =>
  setLabRules(caller, { lab: params.slug }, await body()),
);
