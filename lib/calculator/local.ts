// The calculator's answers, computed in the browser with the same pure code as the solve API
// (parseSolveQuery, solve) and the charts (buildGrid, cellView): no request per keystroke, and
// the same refusals in the same words, said with the measurement's name.
import type { Snapshot, SnapshotLookup } from "@/lib/charts/snapshot";
import { cellView, type CellView } from "@/lib/poster/marks";
import {
  buildGrid,
  DEFAULT_ROUNDING_CAPS,
  formatExactMm,
  GridInputError,
  lawFormula,
  LOOKUP_VESSELS,
  solve,
  type LawSpec,
  type Vessel,
} from "@/lib/sizing";
import { parseSolveQuery, type QueryIssue, type QueryRecord } from "@/lib/validation/solve";

export const MEASUREMENT_NAMES: Readonly<Record<string, string>> = {
  parent: "Parent (proximal main vessel)",
  mb: "Main branch",
  sb: "Side branch",
  law: "Law",
  ratio: "Finet ratio",
  n: "Exponent n",
};

/** "Main branch: must be at most 10 mm": the solve API's message, with the measurement named. */
export function issueText(issue: QueryIssue): string {
  const key = issue.path[0];
  const name = typeof key === "string" ? MEASUREMENT_NAMES[key] : undefined;
  if (!name) return issue.message;
  return `${name}: ${issue.message.charAt(0).toLowerCase()}${issue.message.slice(1)}`;
}

export type LocalIssue = QueryIssue & { text: string };
export type LocalSolve =
  | { ok: true; solved: Vessel; diameterMm: number; diameterLabel: string; formula: string; warnings: string[] }
  | { ok: false; code: "invalid_input" | "no_solution"; message: string; issues: LocalIssue[] };

/** What GET /api/v1/solve answers for the same query record, computed here. */
export function solveLocally(record: QueryRecord): LocalSolve {
  const parsed = parseSolveQuery(record);
  if (!parsed.success)
    return {
      ok: false,
      code: "invalid_input",
      message: parsed.issues.map(issueText).join(" "),
      issues: parsed.issues.map((i) => ({ ...i, text: issueText(i) })),
    };
  const { spec, known } = parsed.data;
  const result = solve(spec, known);
  if (!result.ok) return { ok: false, code: "no_solution", message: result.reason, issues: [] };
  return {
    ok: true,
    solved: result.solved,
    diameterMm: result.diameterMm,
    diameterLabel: formatExactMm(result.diameterMm),
    formula: lawFormula(spec),
    warnings: result.warnings,
  };
}

/** The law's parameters as solve-query text. */
export function lawRecord(law: LawSpec): QueryRecord {
  const out: QueryRecord = { law: law.law };
  if ("ratio" in law) out.ratio = String(law.ratio);
  if ("n" in law) out.n = String(law.n);
  return out;
}

export type LabCell =
  | { ok: true; solved: Vessel; view: CellView; exactLabel: string | null }
  | { ok: false; message: string; issues: LocalIssue[] };

/**
 * One cell of a lab's chart lookup for the two measured diameters, exactly as the chart prints
 * it: the chart's law, balloon family (today's stock), rounding rule, caps and stent platform.
 */
export function labCell(snapshot: Snapshot, lookup: SnapshotLookup, values: Record<string, string>): LabCell {
  const v = LOOKUP_VESSELS[lookup.kind];
  const record: QueryRecord = {
    ...lawRecord(snapshot.law),
    [v.rows]: (values[v.rows] ?? "").trim().replace(",", "."),
    [v.cols]: (values[v.cols] ?? "").trim().replace(",", "."),
  };
  const parsed = parseSolveQuery(record);
  if (!parsed.success)
    return {
      ok: false,
      message: parsed.issues.map(issueText).join(" "),
      issues: parsed.issues.map((i) => ({ ...i, text: issueText(i) })),
    };
  try {
    const grid = buildGrid({
      kind: lookup.kind,
      rows: [parsed.data.known[v.rows]!],
      cols: [parsed.data.known[v.cols]!],
      law: snapshot.law,
      rounding: lookup.rounding,
      family: lookup.family,
      stent: lookup.kind === "proximal" && snapshot.stent ? snapshot.stent.sizes : null,
      caps: snapshot.caps ?? DEFAULT_ROUNDING_CAPS,
    });
    const cell = grid.cells[0]![0]!;
    return {
      ok: true,
      solved: v.solved,
      view: cellView(cell),
      exactLabel: cell.exact.ok ? formatExactMm(cell.exact.diameterMm) : null,
    };
  } catch (err) {
    if (err instanceof GridInputError) return { ok: false, message: err.message, issues: [] };
    throw err;
  }
}
