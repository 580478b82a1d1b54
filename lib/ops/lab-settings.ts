import "server-only";
import * as q from "@/db/queries/lab-settings";
import { labSettingsPatch } from "@/lib/validation/lab-settings";
import { labOperation } from "./operation";
import { labWrite } from "./write";

/** The lab's settings (name, time zone, number format, contact line, demo flag), for every member. */
export const getLabSettings = labOperation({
  name: "lab.settings.get",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId }) => q.getLabSettings({ labId }),
});

/** Changes some settings: managers only; audited with only the changed fields. */
export const updateLabSettings = labOperation({
  name: "lab.settings.update",
  capability: "settings:manage",
  scope: "lab",
  input: labSettingsPatch,
  run: ({ labId, actor }, { name, timeZone, numberFormat, contactLine }) =>
    labWrite(labId, (tx) =>
      q.updateLabSettings(tx, { labId, patch: { name, timeZone, numberFormat, contactLine }, actor }),
    ),
});
