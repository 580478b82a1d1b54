import "server-only";
import { z } from "zod";
import * as q from "@/db/queries/stock";
import { csvIssuesError, parseBalloonCsv } from "@/lib/stock/csv";
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
import { labOperation } from "./operation";
import { labWrite } from "./write";

// Stock: every write is one lab write (lab row locked, change, lab pass, audit row), then mail.

export const getStock = labOperation({
  name: "stock.read",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId }) => q.getStock({ labId }),
});

export const createBalloonFamily = labOperation({
  name: "stock.family.create",
  capability: "stock:edit",
  scope: "lab",
  input: balloonFamilyInput,
  run: ({ labId, actor }, input) =>
    labWrite(labId, (tx) => q.createBalloonFamily(tx, { labId, actorUserId: actor.id, input })),
});

export const updateBalloonFamily = labOperation({
  name: "stock.family.update",
  capability: "stock:edit",
  scope: "lab",
  ids: { familyId: "Balloon family" },
  input: balloonFamilyPatch,
  run: ({ labId, actor, ids }, patch) =>
    labWrite(labId, (tx) => q.updateBalloonFamily(tx, { labId, actorUserId: actor.id, familyId: ids.familyId, patch })),
});

export const deleteBalloonFamily = labOperation({
  name: "stock.family.delete",
  capability: "stock:edit",
  scope: "lab",
  ids: { familyId: "Balloon family" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) => q.deleteBalloonFamily(tx, { labId, actorUserId: actor.id, familyId: ids.familyId })),
});

export const createBalloon = labOperation({
  name: "stock.balloon.create",
  capability: "stock:edit",
  scope: "lab",
  ids: { familyId: "Balloon family" },
  input: balloonInput,
  run: ({ labId, actor, ids }, input) =>
    labWrite(labId, (tx) => q.createBalloon(tx, { labId, actorUserId: actor.id, familyId: ids.familyId, input })),
});

export const updateBalloon = labOperation({
  name: "stock.balloon.update",
  capability: "stock:edit",
  scope: "lab",
  ids: { balloonId: "Balloon" },
  input: balloonPatch,
  run: ({ labId, actor, ids }, patch) =>
    labWrite(labId, (tx) => q.updateBalloon(tx, { labId, actorUserId: actor.id, balloonId: ids.balloonId, patch })),
});

export const deleteBalloon = labOperation({
  name: "stock.balloon.delete",
  capability: "stock:edit",
  scope: "lab",
  ids: { balloonId: "Balloon" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) => q.deleteBalloon(tx, { labId, actorUserId: actor.id, balloonId: ids.balloonId })),
});

export const createStentPlatform = labOperation({
  name: "stock.platform.create",
  capability: "stock:edit",
  scope: "lab",
  input: stentPlatformInput,
  run: ({ labId, actor }, input) =>
    labWrite(labId, (tx) => q.createStentPlatform(tx, { labId, actorUserId: actor.id, input })),
});

export const updateStentPlatform = labOperation({
  name: "stock.platform.update",
  capability: "stock:edit",
  scope: "lab",
  ids: { platformId: "Stent platform" },
  input: stentPlatformInput,
  run: ({ labId, actor, ids }, input) =>
    labWrite(labId, (tx) =>
      q.updateStentPlatform(tx, { labId, actorUserId: actor.id, platformId: ids.platformId, input }),
    ),
});

export const deleteStentPlatform = labOperation({
  name: "stock.platform.delete",
  capability: "stock:edit",
  scope: "lab",
  ids: { platformId: "Stent platform" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) => q.deleteStentPlatform(tx, { labId, actorUserId: actor.id, platformId: ids.platformId })),
});

export const createStentSize = labOperation({
  name: "stock.size.create",
  capability: "stock:edit",
  scope: "lab",
  ids: { platformId: "Stent platform" },
  input: stentSizeInput,
  run: ({ labId, actor, ids }, input) =>
    labWrite(labId, (tx) => q.createStentSize(tx, { labId, actorUserId: actor.id, platformId: ids.platformId, input })),
});

export const updateStentSize = labOperation({
  name: "stock.size.update",
  capability: "stock:edit",
  scope: "lab",
  ids: { sizeId: "Stent size" },
  input: stentSizePatch,
  run: ({ labId, actor, ids }, patch) =>
    labWrite(labId, (tx) => q.updateStentSize(tx, { labId, actorUserId: actor.id, sizeId: ids.sizeId, patch })),
});

export const deleteStentSize = labOperation({
  name: "stock.size.delete",
  capability: "stock:edit",
  scope: "lab",
  ids: { sizeId: "Stent size" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) => q.deleteStentSize(tx, { labId, actorUserId: actor.id, sizeId: ids.sizeId })),
});

/** A balloon CSV: `dryRun` previews; otherwise applies, refusing (409) when `revision` is no longer current. */
export const importBalloonCsv = labOperation({
  name: "stock.import",
  capability: "stock:edit",
  scope: "lab",
  input: importQuery.extend({ file: fileInput("Choose a CSV file.") }),
  run: async ({ labId, actor }, { file: upload, ...query }) => {
    const file = await readFileInput(upload);
    if (file.bytes.byteLength > MAX_IMPORT_BYTES)
      throw payloadTooLarge(file.bytes.byteLength, MAX_IMPORT_BYTES, CSV_TOO_LARGE_HINT);
    const parsed = parseBalloonCsv(await decodeImportFile(file.bytes));
    if (parsed.issues.length) throw csvIssuesError(parsed.issues);
    if (query.dryRun) return q.previewBalloonImport({ labId, rows: parsed.rows });
    return labWrite(labId, (tx) =>
      q.importBalloons(tx, {
        labId,
        actorUserId: actor.id,
        rows: parsed.rows,
        expectRevision: query.revision,
        fileName: file.name,
      }),
    );
  },
});

export const listStockHistory = labOperation({
  name: "stock.history",
  capability: "lab:read",
  scope: "lab",
  input: historyQuery.extend({ limit: z.number().int().min(1).max(100).optional() }),
  run: ({ labId }, { before, limit }) => q.listStockHistory({ labId, before, limit }),
});
