// What a checked stock CSV would change in the lab's stock (stent lines: ./stent-plan.ts). A file lists each of its families'
// whole range: sizes of a listed family that the file leaves out are marked out of stock (never
// deleted); families the file does not mention are left alone.
import type { CsvRow, LineIssue, StentCsvRow } from "./csv";
import { formatAtm, formatMm, hundredths, nameKey } from "./format";
import { emptyStentPlan, planStentImport, type StentPlan } from "./stent-plan";
import type { BalloonFamilyView, FamilyValues, StentPlatformView } from "./types";
import { count } from "@/lib/format/plural";

export type FamilyAdd = FamilyValues & { line: number; sizes: number };
export type FamilyChange = {
  id: number;
  name: string;
  before: FamilyValues;
  after: FamilyValues;
  fields: (keyof FamilyValues)[];
};
export type BalloonAdd = {
  family: string;
  familyId: number | null;
  diameterMm: number;
  inStock: boolean;
  line: number;
};
export type BalloonChange = {
  id: number;
  family: string;
  familyId: number;
  diameterMm: number;
  before: { inStock: boolean };
  after: { inStock: boolean };
  line: number;
};
export type BalloonMarkOut = { id: number; family: string; familyId: number; diameterMm: number };

export type ImportPlan = StentPlan & {
  familiesToAdd: FamilyAdd[];
  familiesToChange: FamilyChange[];
  balloonsToAdd: BalloonAdd[];
  balloonsToChange: BalloonChange[];
  balloonsToMarkOutOfStock: BalloonMarkOut[];
  /** balloons of the listed families that stay exactly as they are */
  unchangedBalloons: number;
  familiesInFile: number;
  rowsInFile: number;
};

/** What the import route answers: the plan, and whether it was applied (never on a dry run). */
export type ImportResult = { dryRun: boolean; applied: boolean; revision: number; summary: string; plan: ImportPlan };

export function isEmptyPlan(plan: ImportPlan): boolean {
  return (
    plan.familiesToAdd.length +
      plan.familiesToChange.length +
      plan.balloonsToAdd.length +
      plan.balloonsToChange.length +
      plan.balloonsToMarkOutOfStock.length +
      plan.platformsToAdd.length +
      plan.stentSizesToAdd.length +
      plan.stentSizesToChange.length +
      plan.stentSizesToRemove.length ===
    0
  );
}

export function summarisePlan(plan: ImportPlan): string {
  const parts = [
    [plan.familiesToAdd.length, "family added", "families added"],
    [plan.familiesToChange.length, "family changed", "families changed"],
    [plan.balloonsToAdd.length, "size added", "sizes added"],
    [plan.balloonsToChange.length, "size changed", "sizes changed"],
    [plan.balloonsToMarkOutOfStock.length, "size marked out of stock", "sizes marked out of stock"],
    [plan.platformsToAdd.length, "stent platform added", "stent platforms added"],
    [plan.stentSizesToAdd.length, "stent size added", "stent sizes added"],
    [plan.stentSizesToChange.length, "stent size changed", "stent sizes changed"],
    [plan.stentSizesToRemove.length, "stent size removed", "stent sizes removed"],
  ] as const;
  const said = parts.filter(([n]) => n > 0).map(([n, one, other]) => count(n, { one, other }));
  return said.length ? said.join(", ") : "no changes";
}

type Given = { value: number; line: number };
type FileFamily = {
  name: string;
  line: number;
  compliance: { value: CsvRow["compliance"]; line: number };
  nominalAtm?: Given;
  rbpAtm?: Given;
  growthAtRbpMm?: Given;
  rows: CsvRow[];
};

const PRESSURE_COLUMNS = { nominalAtm: "nominal_atm", rbpAtm: "rbp_atm", growthAtRbpMm: "growth_at_rbp_mm" } as const;
const FAMILY_FIELDS: (keyof FamilyValues)[] = ["compliance", "nominalAtm", "rbpAtm", "growthAtRbpMm"];

type Counted = Pick<ImportPlan, "familiesInFile" | "rowsInFile">;

function groupFamilies(rows: CsvRow[], issues: LineIssue[]): Map<string, FileFamily> {
  const families = new Map<string, FileFamily>();
  for (const row of rows) {
    const key = nameKey(row.family);
    let fam = families.get(key);
    if (!fam) {
      fam = { name: row.family, line: row.line, compliance: { value: row.compliance, line: row.line }, rows: [] };
      families.set(key, fam);
    } else if (fam.compliance.value !== row.compliance) {
      issues.push({
        line: row.line,
        column: "compliance",
        message: `compliance: "${row.compliance}" differs from "${fam.compliance.value}" given for ${fam.name} on line ${fam.compliance.line}.`,
      });
    }
    for (const field of ["nominalAtm", "rbpAtm", "growthAtRbpMm"] as const) {
      const value = row[field];
      if (value === undefined) continue;
      const given = fam[field];
      if (!given) fam[field] = { value, line: row.line };
      else if (given.value !== value) {
        issues.push({
          line: row.line,
          column: PRESSURE_COLUMNS[field],
          message: `${PRESSURE_COLUMNS[field]}: ${value} differs from ${given.value} given for ${fam.name} on line ${given.line}.`,
        });
      }
    }
    const twin = fam.rows.find((r) => hundredths(r.diameterMm) === hundredths(row.diameterMm));
    if (twin)
      issues.push({
        line: row.line,
        column: "diameter_mm",
        message: `diameter_mm: ${formatMm(row.diameterMm)} mm is already listed for ${fam.name} on line ${twin.line}.`,
      });
    else fam.rows.push(row);
  }
  return families;
}

function planNewFamily(fam: FileFamily, plan: ImportPlan, issues: LineIssue[]) {
  const missing = (["nominalAtm", "rbpAtm"] as const).filter((f) => !fam[f]).map((f) => PRESSURE_COLUMNS[f]);
  if (missing.length) {
    issues.push({
      line: fam.line,
      message: `${fam.name} is a new family: give its ${missing.join(" and ")} (on at least one of its lines).`,
    });
    return;
  }
  const values: FamilyValues = {
    name: fam.name,
    compliance: fam.compliance.value,
    nominalAtm: fam.nominalAtm!.value,
    rbpAtm: fam.rbpAtm!.value,
    growthAtRbpMm: fam.growthAtRbpMm?.value ?? null,
  };
  if (!pressuresInOrder(fam, values, issues)) return;
  plan.familiesToAdd.push({ ...values, line: fam.line, sizes: fam.rows.length });
  for (const row of fam.rows)
    plan.balloonsToAdd.push({
      family: fam.name,
      familyId: null,
      diameterMm: row.diameterMm,
      inStock: row.inStock,
      line: row.line,
    });
}

function planExistingFamily(fam: FileFamily, existing: BalloonFamilyView, plan: ImportPlan, issues: LineIssue[]) {
  const before: FamilyValues = pick(existing);
  const after: FamilyValues = {
    ...before,
    compliance: fam.compliance.value,
    nominalAtm: fam.nominalAtm?.value ?? before.nominalAtm,
    rbpAtm: fam.rbpAtm?.value ?? before.rbpAtm,
    growthAtRbpMm: fam.growthAtRbpMm?.value ?? before.growthAtRbpMm,
  };
  if (!pressuresInOrder(fam, after, issues)) return;
  const fields = FAMILY_FIELDS.filter((f) => before[f] !== after[f]);
  if (fields.length) plan.familiesToChange.push({ id: existing.id, name: existing.name, before, after, fields });

  const named = { family: existing.name, familyId: existing.id };
  const listed = new Map(fam.rows.map((r) => [hundredths(r.diameterMm), r]));
  for (const balloon of existing.balloons) {
    const row = listed.get(hundredths(balloon.diameterMm));
    listed.delete(hundredths(balloon.diameterMm));
    if (row && row.inStock !== balloon.inStock) {
      plan.balloonsToChange.push({
        id: balloon.id,
        ...named,
        diameterMm: balloon.diameterMm,
        before: { inStock: balloon.inStock },
        after: { inStock: row.inStock },
        line: row.line,
      });
    } else if (!row && balloon.inStock) {
      plan.balloonsToMarkOutOfStock.push({ id: balloon.id, ...named, diameterMm: balloon.diameterMm });
    } else plan.unchangedBalloons += 1;
  }
  for (const row of listed.values())
    plan.balloonsToAdd.push({ ...named, diameterMm: row.diameterMm, inStock: row.inStock, line: row.line });
}

/** Groups rows by family, checks them against each other and the current stock, and lists the changes. */
export function planBalloonImport(
  current: BalloonFamilyView[],
  rows: CsvRow[],
): { plan: ImportPlan; issues: LineIssue[] } {
  const issues: LineIssue[] = [];
  const families = groupFamilies(rows, issues);
  const byName = new Map(current.map((f) => [nameKey(f.name), f]));
  const counted: Counted = { familiesInFile: families.size, rowsInFile: rows.length };
  const plan: ImportPlan = {
    familiesToAdd: [],
    familiesToChange: [],
    balloonsToAdd: [],
    balloonsToChange: [],
    balloonsToMarkOutOfStock: [],
    unchangedBalloons: 0,
    ...emptyStentPlan(),
    ...counted,
  };
  for (const fam of families.values()) {
    const existing = byName.get(nameKey(fam.name));
    if (existing) planExistingFamily(fam, existing, plan, issues);
    else planNewFamily(fam, plan, issues);
  }
  const order = (a: { family: string; diameterMm: number }, b: { family: string; diameterMm: number }) =>
    a.family.localeCompare(b.family) || a.diameterMm - b.diameterMm;
  issues.sort((a, b) => a.line - b.line);
  plan.balloonsToAdd.sort(order);
  plan.balloonsToChange.sort(order);
  plan.balloonsToMarkOutOfStock.sort(order);
  return { plan, issues };
}

/** Balloon and stent lines of one file planned together: one plan, every issue by line. */
export function planStockImport(
  current: { balloonFamilies: BalloonFamilyView[]; stentPlatforms: StentPlatformView[] },
  parsed: { rows: CsvRow[]; stentRows: StentCsvRow[] },
): { plan: ImportPlan; issues: LineIssue[] } {
  const balloons = planBalloonImport(current.balloonFamilies, parsed.rows);
  const stents = planStentImport(current.stentPlatforms, parsed.stentRows);
  const issues = [...balloons.issues, ...stents.issues].sort((a, b) => a.line - b.line);
  return {
    plan: { ...balloons.plan, ...stents.plan, rowsInFile: parsed.rows.length + parsed.stentRows.length },
    issues,
  };
}

function pick(f: BalloonFamilyView): FamilyValues {
  return {
    name: f.name,
    compliance: f.compliance,
    nominalAtm: f.nominalAtm,
    rbpAtm: f.rbpAtm,
    growthAtRbpMm: f.growthAtRbpMm,
  };
}

function pressuresInOrder(fam: FileFamily, values: FamilyValues, issues: LineIssue[]): boolean {
  if (values.nominalAtm < values.rbpAtm) return true;
  const where = fam.nominalAtm ?? fam.rbpAtm!;
  issues.push({
    line: where.line,
    column: fam.nominalAtm ? "nominal_atm" : "rbp_atm",
    message: `${fam.name}: the nominal pressure (${formatAtm(values.nominalAtm)} atm) must be below the rated burst pressure (${formatAtm(values.rbpAtm)} atm).`,
  });
  return false;
}
