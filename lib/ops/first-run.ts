import "server-only";
import { balloonFamilyExists, readFirstRunStatus } from "@/db/queries/first-run";
import { importStock } from "@/db/queries/stock-import";
import { AppError } from "@/lib/errors";
import { firstRunSteps } from "@/lib/labs/first-run";
import { ladderFamilySchema } from "@/lib/validation/ladder";
import { labOperation } from "./operation";
import { labWrite } from "./write";

/** The first-run steps of a lab, ticked from what it holds now. */
export const firstRun = labOperation({
  name: "lab.first_run",
  capability: "lab:read",
  scope: "lab",
  run: async ({ labId, member }) => firstRunSteps(member.lab.slug, await readFirstRunStatus({ labId })),
});

/**
 * A new balloon family from the generic size ladder: the ticked diameters, with the pressures the
 * manager typed. One stock change (one revision, one audit event, one lab pass), through the same
 * write as a CSV import.
 */
export const createLadderFamily = labOperation({
  name: "stock.ladder",
  capability: "stock:edit",
  scope: "lab",
  input: ladderFamilySchema,
  run: ({ labId, actor }, input) =>
    labWrite(labId, async (tx) => {
      if (await balloonFamilyExists(tx, { labId, name: input.name }))
        throw new AppError("conflict", "This lab already has a balloon family with that name.", [
          { path: ["name"], message: "Already used: choose another name, or edit that family on the stock page." },
        ]);
      const rows = input.diameters.map((diameterMm, i) => ({
        line: i + 2,
        family: input.name,
        compliance: input.compliance,
        diameterMm,
        inStock: true,
        nominalAtm: input.nominalAtm,
        rbpAtm: input.rbpAtm,
        ...(input.growthAtRbpMm === null ? {} : { growthAtRbpMm: input.growthAtRbpMm }),
      }));
      return importStock(tx, { labId, actorUserId: actor.id, rows, fileName: "generic size ladder" });
    }),
});
