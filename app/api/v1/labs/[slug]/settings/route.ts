import { api } from "@/lib/http/route";
import { getLabSettings, updateLabSettings } from "@/lib/ops/lab-settings";

export const GET = api<{ slug: string }>(({ caller, params }) => getLabSettings(caller, { lab: params.slug }));

// PATCH takes some of the settings; the ones not named keep their value. Answers the settings
// after the change and which fields changed.
export const PATCH = api<{ slug: string }>(async ({ caller, params, body }) =>
  updateLabSettings(caller, { lab: params.slug }, await body()),
);
