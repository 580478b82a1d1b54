import { lawName, type BalloonFamilyStock } from "@/lib/sizing";
import { PAPERS } from "@/lib/poster/paper";
import type { Snapshot, SnapshotLookup } from "./snapshot";

export type ChangeKind = "law" | "stock" | "stent" | "lookup" | "text" | "layout" | "logo" | "lab";
export type Change = { kind: ChangeKind; detail: string };

const LOOKUP_NAMES = {
  proximal: "proximal (POT) lookup",
  side: "side-branch lookup",
  main: "main-branch lookup",
} as const;
const mm = (d: number) => `${d.toFixed(2)} mm`;

function familyChanges(
  kindName: string,
  before: BalloonFamilyStock | null,
  after: BalloonFamilyStock | null,
): Change[] {
  if (!before && !after) return [];
  if (before && !after)
    return [{ kind: "stock", detail: `Balloon family "${before.name}" used by the ${kindName} no longer exists` }];
  if (!before && after) return [{ kind: "stock", detail: `The ${kindName} now uses balloon family "${after.name}"` }];
  const b = before!;
  const a = after!;
  const out: Change[] = [];
  const label = a.compliance.toUpperCase();
  if (b.name !== a.name) out.push({ kind: "stock", detail: `Balloon family "${b.name}" is now "${a.name}"` });
  for (const d of b.diameters.filter((x) => !a.diameters.includes(x)))
    out.push({ kind: "stock", detail: `${mm(d)} ${label} balloon no longer stocked (${a.name})` });
  for (const d of a.diameters.filter((x) => !b.diameters.includes(x)))
    out.push({ kind: "stock", detail: `${mm(d)} ${label} balloon now stocked (${a.name})` });
  if (b.compliance !== a.compliance)
    out.push({ kind: "stock", detail: `${a.name}: compliance changed from ${b.compliance.toUpperCase()} to ${label}` });
  if (b.nominalAtm !== a.nominalAtm)
    out.push({
      kind: "stock",
      detail: `${a.name}: nominal pressure changed from ${b.nominalAtm} to ${a.nominalAtm} atm`,
    });
  if (b.rbpAtm !== a.rbpAtm)
    out.push({ kind: "stock", detail: `${a.name}: rated burst pressure changed from ${b.rbpAtm} to ${a.rbpAtm} atm` });
  if (b.growthAtRbpMm !== a.growthAtRbpMm) {
    const g = (x: number | null) => (x === null ? "not recorded" : mm(x));
    out.push({
      kind: "stock",
      detail: `${a.name}: growth at rated burst pressure changed from ${g(b.growthAtRbpMm)} to ${g(a.growthAtRbpMm)}`,
    });
  }
  return out;
}

const sameList = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

function lookupChanges(before: SnapshotLookup[], after: SnapshotLookup[]): Change[] {
  const out: Change[] = [];
  for (const b of before) {
    const a = after.find((x) => x.kind === b.kind);
    const name = LOOKUP_NAMES[b.kind];
    if (!a) {
      out.push({ kind: "lookup", detail: `The ${name} was removed from the chart` });
      continue;
    }
    if (!sameList(a.rows, b.rows) || !sameList(a.cols, b.cols))
      out.push({ kind: "lookup", detail: `The ${name} now covers different diameters` });
    if (a.rounding !== b.rounding)
      out.push({ kind: "lookup", detail: `The ${name} now rounds ${a.rounding} (was ${b.rounding})` });
    out.push(...familyChanges(name, b.family, a.family));
  }
  for (const a of after)
    if (!before.some((b) => b.kind === a.kind))
      out.push({ kind: "lookup", detail: `A ${LOOKUP_NAMES[a.kind]} was added to the chart` });
  return out;
}

/**
 * Plain words for what differs between a printed edition's snapshot and what the chart would
 * print today. `now` null means the chart itself can no longer be resolved.
 */
export function describeChanges(then: Snapshot, now: Snapshot | null): Change[] {
  if (!now) return [{ kind: "lookup", detail: "The chart this poster was printed from no longer exists" }];
  const out: Change[] = [];
  if (JSON.stringify(then.law) !== JSON.stringify(now.law))
    out.push({ kind: "law", detail: `Law changed from ${lawName(then.law)} to ${lawName(now.law)}` });
  out.push(...lookupChanges(then.lookups, now.lookups));
  const st = then.stent;
  const sn = now.stent;
  if (st && !sn) out.push({ kind: "stent", detail: `Stent platform "${st.name}" is no longer used for hazard marks` });
  else if (!st && sn) out.push({ kind: "stent", detail: `Stent platform "${sn.name}" is now used for hazard marks` });
  else if (st && sn) {
    if (st.name !== sn.name)
      out.push({ kind: "stent", detail: `Stent platform changed from "${st.name}" to "${sn.name}"` });
    else {
      for (const s of sn.sizes) {
        const old = st.sizes.find((x) => x.nominalMm === s.nominalMm);
        if (!old) out.push({ kind: "stent", detail: `${sn.name}: ${mm(s.nominalMm)} stent added` });
        else if (old.maxPostDilatationMm !== s.maxPostDilatationMm)
          out.push({
            kind: "stent",
            detail: `${sn.name}: ${mm(s.nominalMm)} stent's maximum post-dilatation changed from ${mm(old.maxPostDilatationMm)} to ${mm(s.maxPostDilatationMm)}`,
          });
      }
      for (const s of st.sizes)
        if (!sn.sizes.some((x) => x.nominalMm === s.nominalMm))
          out.push({ kind: "stent", detail: `${st.name}: ${mm(s.nominalMm)} stent removed` });
    }
  }
  if (then.title !== now.title) out.push({ kind: "text", detail: `Title changed to "${now.title}"` });
  if (then.notes !== now.notes) out.push({ kind: "text", detail: "Notes changed" });
  if (then.caution !== now.caution) out.push({ kind: "text", detail: "The caution text changed" });
  if (then.lab.name !== now.lab.name) out.push({ kind: "lab", detail: `Lab renamed to "${now.lab.name}"` });
  if (then.paper !== now.paper || then.orientation !== now.orientation)
    out.push({ kind: "layout", detail: `Paper changed to ${PAPERS[now.paper].label} ${now.orientation}` });
  if (then.readingDistanceM !== now.readingDistanceM)
    out.push({ kind: "layout", detail: `Reading distance changed to ${now.readingDistanceM} m` });
  if (JSON.stringify(then.card ?? null) !== JSON.stringify(now.card ?? null))
    out.push({ kind: "layout", detail: "The badge card's sides changed" });
  if (then.logoSha256 !== now.logoSha256)
    out.push({ kind: "logo", detail: now.logoSha256 ? "The lab logo changed" : "The lab logo was removed" });
  return out;
}
