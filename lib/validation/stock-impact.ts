import { z } from "zod";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { idSchema } from "./id";
import { balloonFamilyPatch, balloonPatch, stentPlatformInput, stentSizePatch } from "./stock";

const MAX_ITEMS = 200;

/** `[{ id, ...fields }]`: each item's id and its fields as the stock route for that row takes them. */
function patchList<S extends z.ZodType>(patch: S) {
  return z
    .array(z.record(z.string(), z.unknown()), { error: "Give a list of changes, each with its id." })
    .max(MAX_ITEMS, { error: `At most ${MAX_ITEMS} changes at once.` })
    .transform((items, ctx) => {
      const out: { id: number; patch: z.output<S> }[] = [];
      items.forEach((item, i) => {
        const { id, ...fields } = item;
        const idOk = idSchema.safeParse(id);
        if (!idOk.success)
          ctx.addIssue({ code: "custom", path: [i, "id"], message: "Give the id of the row to change." });
        const parsed = patch.safeParse(fields);
        if (!parsed.success)
          for (const issue of parsed.error.issues)
            ctx.addIssue({ code: "custom", path: [i, ...issue.path], message: issue.message });
        if (idOk.success && parsed.success) out.push({ id: idOk.data, patch: parsed.data });
      });
      return out;
    });
}

/**
 * What the impact route previews: changes to stock rows keyed by id, or a whole stock CSV;
 * never both, never nothing.
 */
export const stockImpactInput = z
  .strictObject({
    balloons: patchList(balloonPatch).optional(),
    families: patchList(balloonFamilyPatch).optional(),
    platforms: patchList(stentPlatformInput).optional(),
    sizes: patchList(stentSizePatch).optional(),
    csv: z
      .string({ error: "csv: give the file's text." })
      .min(1, { error: "csv: the file is empty." })
      .max(MAX_IMPORT_BYTES, { error: "csv: the file is too large." })
      .optional(),
  })
  .superRefine((v, ctx) => {
    const lists = [v.balloons, v.families, v.platforms, v.sizes].filter((l) => l !== undefined);
    if (v.csv !== undefined && lists.length)
      ctx.addIssue({ code: "custom", path: ["csv"], message: "Give either csv or changes by id, not both." });
    else if (v.csv === undefined && !lists.some((l) => l.length))
      ctx.addIssue({
        code: "custom",
        path: ["balloons"],
        message: "Name a change: balloons, families, platforms or sizes by id, or csv.",
      });
  });
export type StockImpactInput = z.output<typeof stockImpactInput>;
