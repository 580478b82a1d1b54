// What an edition prints besides its cells, item by item, in the poster's own words: what an
// approver attests to. Derived from the frozen snapshot with the poster's text helpers, never
// re-worded here, so the approval screen and the PDF cannot drift apart.
import type { Snapshot, SnapshotLookup } from "@/lib/charts/snapshot";
import { DEFAULT_RBP_HEADROOM_ATM } from "@/lib/sizing";
import { gridSubtitleParts, lookupTitle } from "@/lib/poster/labels";
import { legendEntries } from "@/lib/poster/marks";
import { lawHeading, posterLegend, snapshotLegibility } from "@/lib/poster/model";
import { legibilityLine } from "@/lib/poster/legibility";
import { PAPERS } from "@/lib/poster/paper";
import {
  DEFAULT_ROUNDING_CAPS,
  formatConstant,
  formatExactMm,
  formatSizeMm,
  hasGrowthData,
  LAWS,
  type LawSpec,
} from "@/lib/sizing";

export type PrintItemKey =
  | "title"
  | "law"
  | `family:${string}`
  | `rounding:${string}`
  | `headroom:${string}`
  | "caps"
  | "stent"
  | "paper"
  | "legend"
  | "notes"
  | "caution"
  | "exceptions";

export type PrintItem = {
  key: PrintItemKey;
  label: string;
  /** What the poster prints (or, where it prints nothing, says so); compared with the replaced edition. */
  lines: string[];
  /** Who recorded an exception, and similar facts the poster does not print; never compared. */
  notes: string[];
  /** The item differs from the replaced edition's (false when there is none to compare with). */
  changed: boolean;
};

/** Who recorded each exception, by rule id, when known. */
export type ExceptionRecorders = Readonly<Record<string, string>>;

function lawParameter(law: LawSpec): string {
  switch (law.law) {
    case "finet":
      return `Parameter: ratio ${formatConstant(law.ratio)} (Dp over Dmb + Dsb)`;
    case "power":
      return `Parameter: exponent n = ${formatConstant(law.n)}, chosen by the lab`;
    case "huo-kassab":
      return "Parameter: exponent 7/3 (fixed by the law)";
    case "murray":
      return "Parameter: exponent 3 (fixed by the law)";
    case "square":
      return "Parameter: exponent 2 (fixed by the law)";
  }
}

function familyLines(l: SnapshotLookup): string[] {
  const f = l.family;
  if (!f) return ["No balloon family: exact diameters only"];
  const growth = hasGrowthData(f)
    ? `growth at RBP ${formatExactMm(f.growthAtRbpMm ?? 0)} mm`
    : "no growth at RBP recorded";
  return [
    gridSubtitleParts(l, null, true)[0]!,
    `Nominal pressure ${f.nominalAtm} atm, rated burst pressure (RBP) ${f.rbpAtm} atm, ${growth}`,
  ];
}

const lookupLabel = (l: SnapshotLookup) => lookupTitle(l.kind);

function perLookup(snapshot: Snapshot): Omit<PrintItem, "changed">[] {
  const stentName = snapshot.stent?.name ?? null;
  return snapshot.lookups.flatMap((l) => {
    const parts = gridSubtitleParts(l, stentName, true);
    const items: Omit<PrintItem, "changed">[] = [
      { key: `family:${l.kind}`, label: `Balloon family: ${lookupLabel(l)}`, lines: familyLines(l), notes: [] },
      {
        key: `rounding:${l.kind}`,
        label: `Rounding: ${lookupLabel(l)}`,
        lines: [
          parts[1]!,
          `Rows ${formatSizeMm(l.rows[0]!)}–${formatSizeMm(l.rows[l.rows.length - 1]!)} mm, columns ${formatSizeMm(l.cols[0]!)}–${formatSizeMm(l.cols[l.cols.length - 1]!)} mm`,
        ],
        notes: [],
      },
    ];
    if (l.rounding === "reach")
      items.push({
        key: `headroom:${l.kind}`,
        label: `Reach headroom: ${lookupLabel(l)}`,
        lines: [
          l.family && hasGrowthData(l.family)
            ? `Pressures are printed up to the RBP (${l.family.rbpAtm} atm), never above it; a cell whose pressure is within ${l.headroomAtm ?? DEFAULT_RBP_HEADROOM_ATM} atm below it carries the near-RBP mark`
            : "No pressure is printed (no growth at RBP recorded), so there is no headroom to keep",
        ],
        notes: [],
      });
    return items;
  });
}

function stentItem(snapshot: Snapshot, recorders: ExceptionRecorders): Omit<PrintItem, "changed"> {
  const pot = snapshot.lookups.find((l) => l.kind === "proximal");
  const waivers = (snapshot.ruleExceptions ?? []).filter((e) => /stent|platform/i.test(e.rule));
  const lines: string[] = [];
  if (!pot) lines.push("No POT lookup: no stent limit is checked");
  else lines.push(gridSubtitleParts(pot, snapshot.stent?.name ?? null, true)[2]!);
  if (snapshot.stent)
    lines.push(
      `Maximum post-dilatation: ${snapshot.stent.sizes
        .map((s) => `${formatSizeMm(s.nominalMm)} mm → ${formatSizeMm(s.maxPostDilatationMm)} mm`)
        .join(", ")}`,
    );
  for (const e of waivers) lines.push(`Exception to the lab rule “${e.rule}”: ${e.reason}`);
  return {
    key: "stent",
    label: "Stent platform",
    lines,
    notes: waivers.map((e) => recordedBy(e.rule, recorders)),
  };
}

const recordedBy = (rule: string, recorders: ExceptionRecorders) =>
  `“${rule}” recorded by ${recorders[rule] ?? "the medical lead (name not on record)"}`;

function globalItems(snapshot: Snapshot, recorders: ExceptionRecorders): Omit<PrintItem, "changed">[] {
  const caps = snapshot.caps ?? DEFAULT_ROUNDING_CAPS;
  const ctx = {
    law: snapshot.law,
    stentName: snapshot.stent?.name ?? null,
    hasProximal: snapshot.lookups.some((l) => l.kind === "proximal"),
    hasReach: snapshot.lookups.some((l) => l.rounding === "reach"),
    caps,
  };
  const capTexts = legendEntries(ctx)
    .filter((e) => e.mark === "oversize" || e.mark === "undersize")
    .map((e) => `${e.label}: ${e.text}`);
  const legibility = snapshotLegibility(snapshot, { status: "approved" });
  const exceptions = snapshot.ruleExceptions ?? [];
  return [
    { key: "caps", label: "Rounding caps in force", lines: capTexts, notes: [] },
    stentItem(snapshot, recorders),
    {
      key: "paper",
      label: "Paper and reading distance",
      lines: [
        `Printed on ${PAPERS[snapshot.paper].label} ${snapshot.orientation}, to be read from ${snapshot.readingDistanceM.toFixed(1)} m.`,
        legibilityLine(legibility, snapshot.readingDistanceM),
      ],
      notes: [],
    },
    {
      key: "legend",
      label: "Legend",
      lines: posterLegend(snapshot).map((e) => `${e.label}: ${e.text}`),
      notes: [],
    },
    {
      key: "notes",
      label: "Notes",
      lines: [snapshot.notes ? `Notes: ${snapshot.notes}` : "No notes are printed"],
      notes: [],
    },
    { key: "caution", label: "Caution", lines: [`CAUTION. ${snapshot.caution}`], notes: [] },
    {
      key: "exceptions",
      label: "Exceptions in force",
      lines: exceptions.length
        ? exceptions.map((e) => `Exception to the lab rule “${e.rule}”: ${e.reason}`)
        : ["None: the chart keeps every lab rule"],
      notes: exceptions.map((e) => recordedBy(e.rule, recorders)),
    },
  ];
}

/** Every item a snapshot's poster prints besides the cells, in print order, not yet compared. Pure. */
export function printItems(s: Snapshot, recorders: ExceptionRecorders = {}): Omit<PrintItem, "changed">[] {
  return [
    { key: "title", label: "Lab and title", lines: [s.lab.name, s.title], notes: [] },
    {
      key: "law",
      label: "Law",
      lines: [`Law: ${lawHeading(s)}`, lawParameter(s.law), LAWS[s.law.law].source],
      notes: [],
    },
    ...perLookup(s),
    ...globalItems(s, recorders),
  ];
}

/** `items` each marked changed when its printed lines differ from `before`'s (none when there is no before). Pure. */
export function compareItems(
  items: Omit<PrintItem, "changed">[],
  before: Omit<PrintItem, "changed">[] | null,
): PrintItem[] {
  const old = before ? new Map(before.map((i) => [i.key, i.lines.join("\n")])) : null;
  return items.map((i) => ({ ...i, changed: old !== null && old.get(i.key) !== i.lines.join("\n") }));
}

/**
 * Every item the edition's poster prints besides the cells, in print order, each marked changed
 * when its printed lines differ from `before`'s (the edition it replaces or replaced). Pure.
 */
export function editionPrints(
  snapshot: Snapshot,
  before: Snapshot | null,
  recorders: ExceptionRecorders = {},
): PrintItem[] {
  return compareItems(printItems(snapshot, recorders), before ? printItems(before) : null);
}

/** One change of the lab rules as the audit log keeps it: who, and the rules before and after. */
export type RulesChange = { actorName: string | null; before: unknown; after: unknown };

type StoredException = { chartId?: unknown; rule?: unknown; reason?: unknown };
const exceptionsIn = (side: unknown): StoredException[] => {
  const list = side && typeof side === "object" ? (side as { exceptions?: unknown }).exceptions : undefined;
  return Array.isArray(list) ? (list as StoredException[]) : [];
};

/**
 * Who recorded each of a chart's exceptions, by rule: the author of the last rules change (oldest
 * first in `changes`) that added it or changed its reason. Pure.
 */
export function exceptionRecorders(changes: readonly RulesChange[], chartId: number): Record<string, string> {
  const out: Record<string, string> = {};
  for (const c of changes) {
    const before = exceptionsIn(c.before);
    for (const e of exceptionsIn(c.after)) {
      if (e.chartId !== chartId || typeof e.rule !== "string") continue;
      const had = before.some((b) => b.chartId === chartId && b.rule === e.rule && b.reason === e.reason);
      if (!had) out[e.rule] = c.actorName ?? "a former member";
    }
  }
  return out;
}
