import "server-only";
import { z } from "zod";
import * as q from "@/db/queries/charts";
import { listEditions } from "@/db/queries/editions";
import { getWallEdition } from "@/db/queries/wall";
import { mergePatch } from "@/lib/charts/merge-patch";
import { AppError, notFound } from "@/lib/errors";
import { liveGridJson } from "@/lib/charts/grid-model";
import { checkLogo } from "@/lib/logo";
import { fileInput, readFileInput } from "@/lib/upload";
import { chartDefinitionSchema, chartPatchSchema } from "@/lib/validation/chart";
import { labOperation, parseInput } from "./operation";
import { labWrite } from "./write";

// `?archived=1` lists the archived charts instead of the others.
const chartListQuery = z.object({ archived: z.enum(["0", "1"]).optional() }).strict();

/** The lab's charts, each with its current edition (newest approved, else newest draft) and all editions. */
export const listCharts = labOperation({
  name: "chart.list",
  capability: "lab:read",
  scope: "lab",
  input: chartListQuery,
  run: ({ labId }, { archived }) => q.listCharts({ labId, archived: archived === "1" }),
});

/** Archives a chart (managers and the medical lead): it leaves the lists and its posted copies read take-down. */
export const archiveChart = labOperation({
  name: "chart.archive",
  capability: "chart:archive",
  scope: "chart",
  input: z.object({}).strict(),
  run: async ({ labId, actor, ids }) => {
    const r = await labWrite(labId, (tx) =>
      q.setChartArchived(tx, { labId, chartId: ids.chartId, actor, archive: true }),
    );
    return { id: r.id, title: r.title, archivedAt: r.archivedAt!.toISOString() };
  },
});

/** Restores an archived chart (managers and the medical lead): back in the lists, its copies read what they are. */
export const restoreChart = labOperation({
  name: "chart.restore",
  capability: "chart:archive",
  scope: "chart",
  input: z.object({}).strict(),
  run: async ({ labId, actor, ids }) => {
    const r = await labWrite(labId, (tx) =>
      q.setChartArchived(tx, { labId, chartId: ids.chartId, actor, archive: false }),
    );
    return { id: r.id, title: r.title, archivedAt: null };
  },
});

/** One chart with its definition and every edition, newest first. */
export const getChart = labOperation({
  name: "chart.read",
  capability: "lab:read",
  scope: "chart",
  run: async ({ labId, ids }) => {
    const chart = await q.getChart({ labId, chartId: ids.chartId });
    if (!chart) throw notFound("Chart");
    return { chart, editions: await listEditions({ labId, chartId: ids.chartId }) };
  },
});

export const createChart = labOperation({
  name: "chart.create",
  capability: "chart:design",
  scope: "lab",
  input: chartDefinitionSchema,
  run: async ({ labId, actor }, definition) => {
    const { id } = await labWrite(labId, (tx) => q.createChart(tx, { labId, userId: actor.id, definition }));
    return { id, title: definition.title };
  },
});

/** Replaces the whole definition (the designer saves it whole). */
export const saveChart = labOperation({
  name: "chart.save",
  capability: "chart:design",
  scope: "chart",
  input: chartDefinitionSchema,
  run: async ({ labId, actor, ids }, definition) => {
    await labWrite(labId, (tx) => q.updateChart(tx, { labId, chartId: ids.chartId, userId: actor.id, definition }));
    return { id: ids.chartId, definition };
  },
});

/** Changes the fields given and keeps every other one, merged inside the lab lock. */
export const patchChart = labOperation({
  name: "chart.patch",
  capability: "chart:design",
  scope: "chart",
  input: chartPatchSchema,
  run: ({ labId, actor, ids }, patch) =>
    labWrite(labId, async (tx) => {
      const stored = await q.readChartDefinition(tx, { labId, chartId: ids.chartId });
      const definition = parseInput(chartDefinitionSchema, mergePatch(stored, patch));
      await q.updateChart(tx, { labId, chartId: ids.chartId, userId: actor.id, definition });
      return { id: ids.chartId, definition };
    }),
});

export const getChartLogo = labOperation({
  name: "chart.logo.read",
  capability: "lab:read",
  scope: "chart",
  run: async ({ labId, ids }) => {
    const logo = await q.getChartLogo({ labId, chartId: ids.chartId });
    if (!logo) throw notFound("Logo");
    return logo;
  },
});

/** A PNG or JPEG of at most 1 MB, checked from its bytes before it is stored. */
export const setChartLogo = labOperation({
  name: "chart.logo.set",
  capability: "chart:design",
  scope: "chart",
  input: z.object({ file: fileInput("Choose a PNG or JPEG file.") }),
  run: async ({ labId, actor, ids }, { file: upload }) => {
    const file = await readFileInput(upload);
    const checked = await checkLogo(file.bytes);
    const logo = { bytes: Buffer.from(file.bytes), mime: checked.mime, sha256: checked.sha256 };
    const { logoId } = await labWrite(labId, (tx) =>
      q.setChartLogo(tx, { labId, chartId: ids.chartId, userId: actor.id, logo }),
    );
    return { logoId, mime: checked.mime, sha256: checked.sha256, width: checked.width, height: checked.height };
  },
});

export const removeChartLogo = labOperation({
  name: "chart.logo.remove",
  capability: "chart:design",
  scope: "chart",
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) => q.setChartLogo(tx, { labId, chartId: ids.chartId, userId: actor.id, logo: null })),
});

/** What an edition made now would print: the chart's live snapshot, cell by cell (the grid model). */
export const chartGrid = labOperation({
  name: "chart.grid",
  capability: "lab:read",
  scope: "chart",
  run: async ({ labId, ids }) => {
    const chart = await q.getChart({ labId, chartId: ids.chartId });
    if (!chart) throw notFound("Chart");
    if (!chart.liveSnapshot) throw new AppError("unavailable", "This chart's grid is being computed; try again.");
    return liveGridJson(chart.liveSnapshot, chart.definition);
  },
});

/** The wall view: the chart's current approved edition, read-only, for every member. */
export const chartWall = labOperation({
  name: "chart.wall",
  capability: "lab:read",
  scope: "chart",
  run: async ({ labId, ids }) => {
    const wall = await getWallEdition({ labId, chartId: ids.chartId });
    if (!wall) throw notFound("Chart");
    return wall;
  },
});
