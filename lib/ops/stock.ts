import "server-only";
import { z } from "zod";
import * as q from "@/db/queries/stock";
import * as imports from "@/db/queries/stock-import";
import { csvIssuesError, parseStockCsv } from "@/lib/stock/csv";
import { CSV_TOO_LARGE_HINT, decodeImportFile } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { fileInput, payloadTooLarge, readFileInput } from "@/lib/upload";
import {
  balloonFamilyInput,
  balloonFamilyPatch,
  balloonInput,
  balloonPatch,
  historyQuery,
  importQuery,
  stentPlatformInput,
  stentSizeInput,
  stentSizePatch,
} from "@/lib/validation/stock";
import { stockImpactInput } from "@/lib/validation/stock-impact";
import { whatIfLabWrite } from "./impact";
import { labOperation } from "./operation";
import { labWrite } from "./write";

// Stock: every write is one lab write (lab row locked, change, lab pass, audit row), then mail.
// These are the operations a lab's machine tokens may call (stock:read to read, stock:write to
// change); a token's change is audited under its name and runs the same lab pass and mail.

export const getStock = labOperation({
  name: "stock.read",
  capability: "lab:read",
  scope: "lab",
  machine: "stock:read",
  run: ({ labId }) => q.getStock({ labId }),
});

export const createBalloonFamily = labOperation({
  name: "stock.family.create",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  input: balloonFamilyInput,
  run: ({ labId, by }, input) => labWrite(labId, (tx) => q.createBalloonFamily(tx, { labId, ...by, input })),
});

export const updateBalloonFamily = labOperation({
  name: "stock.family.update",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { familyId: "Balloon family" },
  input: balloonFamilyPatch,
  run: ({ labId, by, ids }, patch) =>
    labWrite(labId, (tx) => q.updateBalloonFamily(tx, { labId, ...by, familyId: ids.familyId, patch })),
});

export const deleteBalloonFamily = labOperation({
  name: "stock.family.delete",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { familyId: "Balloon family" },
  run: ({ labId, by, ids }) =>
    labWrite(labId, (tx) => q.deleteBalloonFamily(tx, { labId, ...by, familyId: ids.familyId })),
});

export const createBalloon = labOperation({
  name: "stock.balloon.create",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { familyId: "Balloon family" },
  input: balloonInput,
  run: ({ labId, by, ids }, input) =>
    labWrite(labId, (tx) => q.createBalloon(tx, { labId, ...by, familyId: ids.familyId, input })),
});

export const updateBalloon = labOperation({
  name: "stock.balloon.update",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { balloonId: "Balloon" },
  input: balloonPatch,
  run: ({ labId, by, ids }, patch) =>
    labWrite(labId, (tx) => q.updateBalloon(tx, { labId, ...by, balloonId: ids.balloonId, patch })),
});

export const deleteBalloon = labOperation({
  name: "stock.balloon.delete",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { balloonId: "Balloon" },
  run: ({ labId, by, ids }) => labWrite(labId, (tx) => q.deleteBalloon(tx, { labId, ...by, balloonId: ids.balloonId })),
});

export const createStentPlatform = labOperation({
  name: "stock.platform.create",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  input: stentPlatformInput,
  run: ({ labId, by }, input) => labWrite(labId, (tx) => q.createStentPlatform(tx, { labId, ...by, input })),
});

export const updateStentPlatform = labOperation({
  name: "stock.platform.update",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { platformId: "Stent platform" },
  input: stentPlatformInput,
  run: ({ labId, by, ids }, input) =>
    labWrite(labId, (tx) => q.updateStentPlatform(tx, { labId, ...by, platformId: ids.platformId, input })),
});

export const deleteStentPlatform = labOperation({
  name: "stock.platform.delete",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { platformId: "Stent platform" },
  run: ({ labId, by, ids }) =>
    labWrite(labId, (tx) => q.deleteStentPlatform(tx, { labId, ...by, platformId: ids.platformId })),
});

export const createStentSize = labOperation({
  name: "stock.size.create",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { platformId: "Stent platform" },
  input: stentSizeInput,
  run: ({ labId, by, ids }, input) =>
    labWrite(labId, (tx) => q.createStentSize(tx, { labId, ...by, platformId: ids.platformId, input })),
});

export const updateStentSize = labOperation({
  name: "stock.size.update",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { sizeId: "Stent size" },
  input: stentSizePatch,
  run: ({ labId, by, ids }, patch) =>
    labWrite(labId, (tx) => q.updateStentSize(tx, { labId, ...by, sizeId: ids.sizeId, patch })),
});

export const deleteStentSize = labOperation({
  name: "stock.size.delete",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  ids: { sizeId: "Stent size" },
  run: ({ labId, by, ids }) => labWrite(labId, (tx) => q.deleteStentSize(tx, { labId, ...by, sizeId: ids.sizeId })),
});

/** A stock CSV (balloons and stents): `dryRun` previews; otherwise applies, refusing (409) when `revision` is no longer current. */
export const importBalloonCsv = labOperation({
  name: "stock.import",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  input: importQuery.extend({ file: fileInput("Choose a CSV file.") }),
  run: async ({ labId, by }, { file: upload, ...query }) => {
    const file = await readFileInput(upload);
    if (file.bytes.byteLength > MAX_IMPORT_BYTES)
      throw payloadTooLarge(file.bytes.byteLength, MAX_IMPORT_BYTES, CSV_TOO_LARGE_HINT);
    const parsed = parseStockCsv(await decodeImportFile(file.bytes));
    if (parsed.issues.length) throw csvIssuesError(parsed.issues);
    const { rows, stentRows } = parsed;
    if (query.dryRun) return imports.previewStockImport({ labId, rows, stentRows });
    return labWrite(labId, (tx) =>
      imports.importStock(tx, {
        labId,
        ...by,
        rows,
        stentRows,
        expectRevision: query.revision,
        fileName: file.name,
      }),
    );
  },
});

/** Reads a stock CSV's text into checked rows, or throws the 400 naming each bad line. */
function checkedCsv(text: string) {
  const parsed = parseStockCsv(text);
  if (parsed.issues.length) throw csvIssuesError(parsed.issues);
  return { rows: parsed.rows, stentRows: parsed.stentRows };
}

/**
 * Which posted copies a stock change would make outdated, writing nothing: the change (rows by
 * id, or a CSV) runs as the stock routes run it, inside a transaction that is rolled back.
 */
export const stockImpact = labOperation({
  name: "stock.impact",
  capability: "stock:edit",
  scope: "lab",
  machine: "stock:write",
  input: stockImpactInput,
  run: async ({ labId, by }, input) => {
    const outdates = await whatIfLabWrite(labId, async (tx) => {
      if (input.csv !== undefined) return imports.importStock(tx, { labId, ...by, ...checkedCsv(input.csv) });
      for (const { id, patch } of input.families ?? [])
        await q.updateBalloonFamily(tx, { labId, ...by, familyId: id, patch });
      for (const { id, patch } of input.balloons ?? [])
        await q.updateBalloon(tx, { labId, ...by, balloonId: id, patch });
      for (const { id, patch } of input.platforms ?? [])
        await q.updateStentPlatform(tx, { labId, ...by, platformId: id, input: patch });
      for (const { id, patch } of input.sizes ?? []) await q.updateStentSize(tx, { labId, ...by, sizeId: id, patch });
    });
    return { outdates };
  },
});

export const listStockHistory = labOperation({
  name: "stock.history",
  capability: "lab:read",
  scope: "lab",
  machine: "stock:read",
  input: historyQuery.extend({ limit: z.number().int().min(1).max(100).optional() }),
  run: ({ labId }, { before, limit }) => q.listStockHistory({ labId, before, limit }),
});
