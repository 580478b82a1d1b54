// The one definition of how a grid cell looks, shared by the PDF poster and the HTML preview.
// Every mark has a symbol, a pattern or border AND a word in the legend, so colour is never the
// only signal. Backgrounds are spaced in lightness so they also separate in greyscale and for
// colour-blind readers (blue/orange/neutral grey; tests/unit/poster/palette.test.ts checks it).
import {
  ASYMMETRIC_FIT_MAX_SB_MB,
  FINET_FIT_MIN_SB_MB,
  formatExactMm as formatExact,
  formatSizeMm,
  type BalloonPick,
  type Cell,
  type LawSpec,
  type RoundingCaps,
} from "@/lib/sizing";

export const INK = "#17212b";
export const INK_SOFT = "#3d4b59";
export const PAPER_WHITE = "#ffffff";

export const PALETTE = {
  ink: INK,
  inkSoft: INK_SOFT,
  cell: PAPER_WHITE,
  /** Row and column headings. */
  heading: "#e8eef2",
  rule: "#7d8a96",
  hatch: "#8c8c8c",
  /** Caution box: warm tint with a dark border. */
  caution: "#fdf1dc",
  cautionBorder: "#8a5300",
  /** Status banner and draft watermark. */
  banner: "#a3261f",
  bannerText: "#ffffff",
  watermark: "#a3261f",
} as const;

export type MarkId = "noSize" | "noStock" | "hazard" | "oversize" | "undersize" | "outsideFit" | "nearRbp";

export type MarkDef = {
  id: MarkId;
  /** Printed in the cell and in the legend. */
  symbol: string;
  /** Legend heading, a few words. */
  label: string;
  /** Legend explanation, one sentence. */
  explanation: string;
  /** Cell background, or null when the mark only overlays (keeps the cell's own background). */
  background: string | null;
  /** Diagonal hatching over the background. */
  hatch: boolean;
  /** Heavy inset border, as a fraction of the cell's shorter side. */
  border: number;
};

export const MARKS: Readonly<Record<MarkId, MarkDef>> = {
  noSize: {
    id: "noSize",
    symbol: "—",
    label: "No size",
    explanation:
      "These diameters do not form a bifurcation under this law (parent > main branch ≥ side branch); grey hatched, no number.",
    background: "#c8c8c8",
    hatch: true,
    border: 0,
  },
  noStock: {
    id: "noStock",
    symbol: "▲▼",
    label: "No stocked size",
    explanation:
      "▲ above the largest or ▼ below the smallest stocked balloon (○ none in stock); blue, the exact diameter small.",
    background: "#d5e7f7",
    hatch: false,
    border: 0,
  },
  hazard: {
    id: "hazard",
    // A square, so no two marks share a shape: triangles say "no stocked size", arrows the caps,
    // the diamond the published fit, the dash "no size".
    symbol: "■",
    label: "Stent limit",
    explanation:
      "POT above the main-branch stent's maximum post-dilatation diameter, or no stent covers this main branch; orange, heavy border.",
    background: "#e69f00",
    hatch: false,
    border: 0.06,
  },
  oversize: {
    id: "oversize",
    symbol: "↑",
    label: "Above the rounding cap",
    explanation:
      "The printed balloon is further above the exact diameter than the lab's cap allows (a gap in stock); choose with care.",
    background: null,
    hatch: false,
    border: 0,
  },
  undersize: {
    id: "undersize",
    symbol: "↓",
    label: "Below the rounding cap",
    explanation:
      "The printed balloon is further below the exact diameter than the lab's cap allows (a gap in stock); choose with care.",
    background: null,
    hatch: false,
    border: 0,
  },
  nearRbp: {
    id: "nearRbp",
    symbol: "!",
    label: "Near rated burst pressure",
    explanation:
      "The printed pressure is within the lab's headroom below the balloon's rated burst pressure; check the device's own compliance chart.",
    background: null,
    hatch: false,
    border: 0,
  },
  outsideFit: {
    id: "outsideFit",
    symbol: "◇",
    label: "Outside published fit",
    explanation: "The law was reported to fit mainly other bifurcation shapes (Dsb/Dmb); read with care.",
    background: null,
    hatch: false,
    border: 0,
  },
};

export const MARK_ORDER: readonly MarkId[] = [
  "noSize",
  "noStock",
  "hazard",
  "oversize",
  "undersize",
  "nearRbp",
  "outsideFit",
];

/** Marks drawn as a symbol in the cell's corner (the others change the cell's primary text or background). */
export const CORNER_MARKS: readonly MarkId[] = ["hazard", "oversize", "undersize", "nearRbp", "outsideFit"];

/** Backgrounds a cell can take, for the palette tests. */
export const CELL_BACKGROUNDS: Readonly<Record<"sized" | "noSize" | "noStock" | "hazard", string>> = {
  sized: PAPER_WHITE,
  noSize: MARKS.noSize.background as string,
  noStock: MARKS.noStock.background as string,
  hazard: MARKS.hazard.background as string,
};

/** Every text colour printed on every background it can meet, for the contrast test. */
export const TEXT_ON_BACKGROUND: readonly { what: string; text: string; background: string }[] = [
  ...Object.entries(CELL_BACKGROUNDS).map(([k, bg]) => ({ what: `cell figures on ${k}`, text: INK, background: bg })),
  { what: "headings", text: INK, background: PALETTE.heading },
  { what: "small print", text: INK_SOFT, background: PAPER_WHITE },
  { what: "caution", text: INK, background: PALETTE.caution },
  { what: "status banner", text: PALETTE.bannerText, background: PALETTE.banner },
];

/** Balloon diameters as labelled on the shelf: one or two decimals (3.0, 2.75, 2.5). */
export const formatBalloonMm = formatSizeMm;

/** Exact diameters from the law, always two decimals, rounded half away from zero in decimal. */
export const formatExactMm = formatExact;

/** Axis headings: the values as entered, one or two decimals. */
export const formatAxisMm = formatBalloonMm;

const NO_STOCK_SYMBOL: Readonly<Record<"above_stock" | "below_stock" | "no_stock", string>> = {
  above_stock: "▲",
  below_stock: "▼",
  no_stock: "○",
};

export type CellView = {
  /** The large text: a stocked balloon, the exact size (no family), or a mark's symbol. */
  primary: string;
  primaryIsSize: boolean;
  /** "@ 16 atm" when the balloon must be pushed above nominal. */
  pressure: string | null;
  /** The exact diameter, small, in parentheses; null when there is none or it is the primary. */
  exact: string | null;
  marks: MarkId[];
  background: string;
  hatch: boolean;
  /** Heavy border as a fraction of the cell's shorter side (0 = normal rule). */
  border: number;
  /** The whole cell in words, for screen readers and hover titles. */
  description: string;
};

function pickWords(pick: BalloonPick): string {
  if (pick.ok) {
    const at = pick.pressureAtm === null ? "at nominal pressure" : `at ${pick.pressureAtm} atm`;
    return `${formatBalloonMm(pick.diameterMm)} mm balloon ${at}`;
  }
  return `No stocked size: ${pick.reason}`;
}

/** How one cell prints. Pure: the PDF and the HTML preview both call this. */
export function cellView(cell: Cell): CellView {
  if (!cell.exact.ok) {
    return {
      primary: MARKS.noSize.symbol,
      primaryIsSize: false,
      pressure: null,
      exact: null,
      marks: ["noSize"],
      background: CELL_BACKGROUNDS.noSize,
      hatch: true,
      border: 0,
      description: `No size: ${cell.exact.reason}`,
    };
  }
  const exactMm = cell.exact.diameterMm;
  const marks: MarkId[] = [];
  const words: string[] = [];
  let primary: string;
  let primaryIsSize = true;
  let pressure: string | null = null;
  let exact: string | null = `(${formatExactMm(exactMm)})`;
  const pick = cell.balloon;
  if (!pick) {
    primary = formatExactMm(exactMm);
    exact = null;
    words.push(`exact ${formatExactMm(exactMm)} mm (no balloon family)`);
  } else if (!pick.ok) {
    marks.push("noStock");
    primary = NO_STOCK_SYMBOL[pick.code];
    primaryIsSize = false;
    words.push(pickWords(pick), `exact ${formatExactMm(exactMm)} mm`);
  } else {
    primary = formatBalloonMm(pick.diameterMm);
    if (pick.pressureAtm !== null) pressure = `@ ${pick.pressureAtm} atm`;
    words.push(pickWords(pick), `exact ${formatExactMm(exactMm)} mm`);
  }
  if (cell.flags.hazard) {
    marks.push("hazard");
    words.push(`Stent limit: ${cell.hazardDetail ?? "above the stent's post-dilatation limit"}`);
  }
  if (cell.flags.oversize) {
    marks.push("oversize");
    words.push(`Above the rounding cap: ${cell.capDetail ?? "further above the exact diameter than the cap"}`);
  }
  if (cell.flags.undersize) {
    marks.push("undersize");
    words.push(`Below the rounding cap: ${cell.capDetail ?? "further below the exact diameter than the cap"}`);
  }
  if (cell.flags.nearRbp) {
    marks.push("nearRbp");
    words.push(`Near rated burst pressure: ${cell.rbpDetail ?? "within the lab's headroom"}`);
  }
  if (cell.flags.outsideFit) {
    marks.push("outsideFit");
    words.push(`Outside published fit: ${cell.fitNote ?? "read with care"}`);
  }
  const background = cell.flags.hazard
    ? CELL_BACKGROUNDS.hazard
    : marks.includes("noStock")
      ? CELL_BACKGROUNDS.noStock
      : CELL_BACKGROUNDS.sized;
  return {
    primary,
    primaryIsSize,
    pressure,
    exact,
    marks,
    background,
    hatch: false,
    border: cell.flags.hazard ? MARKS.hazard.border : 0,
    description: words.join("; "),
  };
}

/** Symbols shown in a cell's corner: every mark except the one already printed as the primary. */
export function cornerSymbols(view: CellView): string {
  return view.marks
    .filter((m) => CORNER_MARKS.includes(m))
    .map((m) => MARKS[m].symbol)
    .join("");
}

export type LegendEntry = {
  mark: MarkId | "sized";
  label: string;
  /** What the poster prints: short enough for three lines on A1 (tests/tools/poster/text-units.test.ts). */
  text: string;
  /** The full explanation, where the printed text leaves some out: for the chart's check page. */
  detail?: string;
  /** A real cell of the chart that shows the mark, printed as the legend's sample. */
  sample?: CellView;
};

export type LegendContext = {
  law: LawSpec;
  stentName: string | null;
  hasProximal: boolean;
  hasReach: boolean;
  /** The caps the marks were drawn against; the defaults when absent. */
  caps?: RoundingCaps;
  /** The headroom below rated burst pressure that reach cells are marked within, atm. */
  headroomAtm?: number;
  /** When lookups differ in caps (the lab's caps are per lookup kind): each lookup's, named. */
  capsByLookup?: readonly { name: string; caps: RoundingCaps }[];
};

/** "0.25 mm", or "0.25 mm (POT), 0.5 mm (side branch)" when the lookups differ. */
function capWords(ctx: LegendContext, side: keyof RoundingCaps): string {
  const each = ctx.capsByLookup ?? [];
  const values = new Set(each.map((c) => c.caps[side]));
  if (values.size > 1) return each.map((c) => `${formatSizeMm(c.caps[side])} mm (${c.name})`).join(", ");
  return `${formatSizeMm((ctx.caps ?? { upMm: 0.25, downMm: 0.5 })[side])} mm`;
}

/** Legend lines for a poster: how to read a cell, then each mark made specific to its law and stent. */
/** The stent-limit check in full, for the check page. */
const hazardDetail = (stentName: string) =>
  `The POT balloon at rated burst pressure (by its growth; at nominal where none is recorded) is above the maximum post-dilatation diameter of any ${stentName} stent an operator might size to the main branch (the nearest nominal at or below it up to the nearest at or above it), or no stent of it covers the main branch.`;

export function legendEntries(ctx: LegendContext): LegendEntry[] {
  const text = (m: MarkId): string => {
    if (m === "hazard") {
      if (!ctx.hasProximal) return "Checked on POT grids only; this chart has none.";
      if (!ctx.stentName) return "Not checked: no stent platform was chosen for this chart.";
      return `POT balloon at rated burst pressure wider than the ${ctx.stentName} sizes for this main branch can be post-dilated to, or no size covers it; orange, heavy border.`;
    }
    if (m === "oversize" || m === "undersize") {
      return m === "oversize"
        ? `The printed balloon is more than ${capWords(ctx, "upMm")} above the exact diameter (the lab's cap; a gap in stock): choose with care.`
        : `The printed balloon is more than ${capWords(ctx, "downMm")} below the exact diameter (the lab's cap; a gap in stock): choose with care.`;
    }
    if (m === "nearRbp")
      return `The printed pressure is within ${formatSizeMm(ctx.headroomAtm ?? 1)} atm of the balloon's rated burst pressure (the lab's headroom): check the device's own compliance chart.`;
    if (m === "outsideFit") {
      switch (ctx.law.law) {
        case "finet":
          return `Finet's ratio fitted mainly near-symmetric bifurcations (Dsb/Dmb ≥ ${FINET_FIT_MIN_SB_MB}); read marked cells with care.`;
        case "murray":
        case "square":
          return `This law fitted mainly very asymmetric bifurcations (Dsb/Dmb ≤ ${ASYMMETRIC_FIT_MAX_SB_MB}); read marked cells with care.`;
        case "huo-kassab":
          return "Huo et al. 2012 report the 7/3 law fitted every bifurcation type measured: no cell is marked.";
        case "power":
          return "A lab-chosen exponent has no published fit range: no cell is marked.";
      }
    }
    return MARKS[m].explanation;
  };
  const sized: LegendEntry = {
    mark: "sized",
    label: "Stocked balloon",
    text:
      "Large: the stocked balloon, mm. Small, in brackets: the exact diameter from the law, mm." +
      (ctx.hasReach ? " “@ N atm”: reaches the target at N atm, never above rated burst pressure." : ""),
    ...(ctx.hasReach
      ? {
          detail:
            "“@ N atm”: this balloon reaches the target at N atm by linear compliance, never above its rated burst pressure; the device's own compliance chart rules.",
        }
      : {}),
  };
  return [
    sized,
    ...MARK_ORDER.map((m) => ({
      mark: m,
      label: `${MARKS[m].symbol} ${MARKS[m].label}`,
      text: text(m),
      ...(m === "hazard" && ctx.hasProximal && ctx.stentName ? { detail: hazardDetail(ctx.stentName) } : {}),
    })),
  ];
}
