// The grid API over HTTP against the running app and the seeded demo lab: its exact shape, that
// it agrees with the poster PDF cell for cell, and that charts breaking a lookup rule are refused.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { pdfText } from "../support/pdf-tools";
import { apiAs } from "./support/auth";

let operator: APIRequestContext;
let educator: APIRequestContext;
test.beforeAll(async ({ baseURL }) => {
  operator = await apiAs(baseURL!, "operator");
  educator = await apiAs(baseURL!, "educator");
});
test.afterAll(async () => {
  await operator.dispose();
  await educator.dispose();
});

type Cell = {
  exactMm: number | null;
  exactLabel: string | null;
  sizeMm: number | null;
  sizeLabel: string | null;
  atm: number | null;
  marks: string[];
};

const potChart = async () => {
  const list = (await (await operator.get("/api/v1/labs/demo/charts")).json()) as {
    id: number;
    title: string;
    currentEdition: { id: number } | null;
  }[];
  return list.find((c) => c.title === "POT balloon chart (demo)")!;
};

test("chart and edition grids answer the documented shape, and agree while the edition is current", async () => {
  const chart = await potChart();
  const live = await operator.get(`/api/v1/charts/${chart.id}/grid`);
  expect(live.status()).toBe(200);
  const body = await live.json();
  expect(Object.keys(body)).toEqual(["lookups"]);
  const lookup = body.lookups[0];
  expect(Object.keys(lookup)).toEqual(["kind", "rounding", "familyId", "rows", "cols", "outsideFitShare", "cells"]);
  expect(lookup).toMatchObject({ kind: "proximal", rounding: "up" });
  expect(typeof lookup.outsideFitShare).toBe("number");
  const names = new Set([
    "not-bifurcation",
    "below-stock",
    "above-stock",
    "stent-limit",
    "oversize",
    "undersize",
    "outside-fit",
  ]);
  for (const cell of lookup.cells.flat() as Cell[]) {
    expect(Object.keys(cell)).toEqual(["exactMm", "exactLabel", "sizeMm", "sizeLabel", "atm", "marks"]);
    for (const m of cell.marks) expect(names.has(m)).toBe(true);
  }
  const frozen = await operator.get(`/api/v1/editions/${chart.currentEdition!.id}/grid`);
  expect(frozen.status()).toBe(200);
  expect((await frozen.json()).lookups[0].cells).toEqual(lookup.cells);
  expect((await operator.get("/api/v1/editions/999999999/grid")).status()).toBe(404);
});

test("the approved poster PDF prints what the grid API answers, cell for cell", async () => {
  const chart = await potChart();
  const grid = (await (await operator.get(`/api/v1/editions/${chart.currentEdition!.id}/grid`)).json()).lookups[0];
  const pdf = await operator.get(`/api/v1/editions/${chart.currentEdition!.id}/pdf`);
  expect(pdf.status()).toBe(200);
  const text = (await pdfText(Buffer.from(await pdf.body()))).text.replace(/\s+/g, " ");
  // Each printed cell appears in reading order as "(exact) [marks] size".
  const CORNER: Record<string, string> = { "stent-limit": "■", oversize: "↑", undersize: "↓", "outside-fit": "◇" };
  let from = text.indexOf("Dmb ↓");
  expect(from).toBeGreaterThan(0);
  for (const cell of grid.cells.flat() as Cell[]) {
    if (cell.sizeLabel === null) continue;
    const corner = cell.marks.map((m) => CORNER[m] ?? "").join("");
    const printed = `(${cell.exactLabel}) ${corner ? `${corner} ` : ""}${cell.sizeLabel}`;
    const at = text.indexOf(printed, from);
    expect(at, printed).toBeGreaterThan(from);
    from = at + printed.length;
  }
});

test("a chart that breaks a lookup rule is refused with a 400 naming the rule", async () => {
  const chart = await potChart();
  const def = (await (await educator.get(`/api/v1/charts/${chart.id}`)).json()).definition;
  const bad = { ...def, title: `Rule test ${Date.now()}`, lookups: [{ ...def.lookups[0], rounding: "down" }] };
  const res = await educator.post("/api/v1/labs/demo/charts", { data: bad });
  expect(res.status()).toBe(400);
  const body = await res.json();
  expect(body.error.message).toMatch(/Rule "proximal rounding"/);
  expect(body.error.issues[0].path).toEqual(["lookups", 0, "rounding"]);
});
