// Turns a stock audit event's before/after into rows a person can read.
import { formatAtm, formatMm, hundredths } from "./format";

export type HistoryRow = { label: string; before: string; after: string };

export const FIELD_LABELS: Record<string, string> = {
  name: "Name",
  compliance: "Compliance",
  nominalAtm: "Nominal pressure",
  rbpAtm: "Rated burst pressure",
  growthAtRbpMm: "Growth at rated burst pressure",
  family: "Family",
  diameterMm: "Diameter",
  inStock: "In stock",
  platform: "Platform",
  nominalMm: "Nominal diameter",
  maxPostDilatationMm: "Maximum post-dilatation",
  balloons: "Sizes",
  sizes: "Sizes",
};

const NONE = "—";
type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);

export function formatStockValue(key: string, value: unknown): string {
  if (value === null || value === undefined) return key === "growthAtRbpMm" ? "not recorded" : NONE;
  if (key === "inStock") return value ? "in stock" : "out of stock";
  if (typeof value === "number") {
    if (key.endsWith("Atm")) return `${formatAtm(value)} atm`;
    if (key.endsWith("Mm")) return `${formatMm(value)} mm`;
  }
  if (key === "balloons" && Array.isArray(value)) {
    return `${value.length}: ${value.map((b: Obj) => `${formatMm(Number(b.diameterMm))}${b.inStock ? "" : " (out of stock)"}`).join(", ")}`;
  }
  if (key === "sizes" && Array.isArray(value)) {
    return `${value.length}: ${value.map((s: Obj) => `${formatMm(Number(s.nominalMm))} (to ${formatMm(Number(s.maxPostDilatationMm))})`).join(", ")}`;
  }
  return String(value);
}

/** Field rows: every field of a created or deleted thing, only the changed fields of an update. */
function fieldRows(before: Obj | null, after: Obj | null, prefix = ""): HistoryRow[] {
  const keys = [...new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})])];
  return keys
    .filter((k) => !before || !after || JSON.stringify(before[k]) !== JSON.stringify(after[k]))
    .map((k) => ({
      label: `${prefix}${FIELD_LABELS[k] ?? k}`,
      before: before ? formatStockValue(k, before[k]) : NONE,
      after: after ? formatStockValue(k, after[k]) : NONE,
    }));
}

type ImportFamily = Obj & { name: string; balloons: { diameterMm: number; inStock: boolean }[] };

const withoutSizes = (fam: ImportFamily): Obj =>
  Object.fromEntries(Object.entries(fam).filter(([k]) => k !== "balloons"));

function importRows(before: ImportFamily[], after: ImportFamily[]): HistoryRow[] {
  const rows: HistoryRow[] = [];
  for (const fam of after) {
    const old = before.find((f) => f.name === fam.name);
    const { balloons: newSizes, ...values } = fam;
    if (!old) {
      rows.push({
        label: fam.name,
        before: NONE,
        after: `new family: ${fieldRows(null, values)
          .filter((r) => r.label !== "Name")
          .map((r) => `${r.label.toLowerCase()} ${r.after}`)
          .join(", ")}`,
      });
    } else {
      rows.push(...fieldRows(withoutSizes(old), values, `${fam.name}: `));
    }
    const oldSizes = new Map((old?.balloons ?? []).map((b) => [hundredths(b.diameterMm), b]));
    for (const b of newSizes) {
      const prev = oldSizes.get(hundredths(b.diameterMm));
      if (!prev || prev.inStock !== b.inStock) {
        rows.push({
          label: `${fam.name} ${formatMm(b.diameterMm)} mm`,
          before: prev ? formatStockValue("inStock", prev.inStock) : NONE,
          after: formatStockValue("inStock", b.inStock),
        });
      }
    }
  }
  return rows;
}

export function describeStockChange(action: string, detail: unknown): HistoryRow[] {
  if (!isObj(detail)) return [];
  const before = isObj(detail.before) ? detail.before : null;
  const after = isObj(detail.after) ? detail.after : null;
  if (action === "stock.import") {
    const list = (v: Obj | null) => (Array.isArray(v?.families) ? (v.families as ImportFamily[]) : []);
    return importRows(list(before), list(after));
  }
  return fieldRows(before, after);
}

export const STOCK_ACTION_LABELS: Record<string, string> = {
  "stock.family.create": "Balloon family added",
  "stock.family.update": "Balloon family changed",
  "stock.family.delete": "Balloon family deleted",
  "stock.balloon.create": "Balloon size added",
  "stock.balloon.update": "Balloon size changed",
  "stock.balloon.delete": "Balloon size removed",
  "stock.platform.create": "Stent platform added",
  "stock.platform.update": "Stent platform renamed",
  "stock.platform.delete": "Stent platform deleted",
  "stock.size.create": "Stent size added",
  "stock.size.update": "Stent size changed",
  "stock.size.delete": "Stent size removed",
  "stock.import": "CSV import",
};
