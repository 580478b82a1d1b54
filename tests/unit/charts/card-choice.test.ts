// The badge card's side choice: the schema that guards it, what the snapshot freezes, which
// rows and columns each side prints, and the designer's words about it.
import { describe, expect, it } from "vitest";
import { describeChanges } from "@/lib/charts/changes";
import {
  axisSentence,
  capacitySentence,
  cardAfterRemovingLookup,
  planCardSide,
  shownCardSides,
} from "@/lib/charts/card-choice";
import { wordingOnly } from "@/lib/charts/clinical";
import { clinicalFingerprint, fingerprintOf } from "@/lib/charts/fingerprint";
import { cardCapacity, cardGrid, cardSides } from "@/lib/poster/card";
import { snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import { chartDefinitionSchema, chartPatchSchema } from "@/lib/validation/chart";
import { describeDetail } from "@/lib/audit/describe";
import { potDefinition, snapshotOf } from "../../support/poster-fixtures";

// Two lookups: POT rows 2.5-4.0 (7) x cols 2.0-3.5 (7); side-branch rows 3.0-4.5 (7) x cols 2.5-4.0 (7).
const twoLookups = {
  ...potDefinition,
  lookups: [
    potDefinition.lookups[0],
    {
      kind: "side",
      rows: { from: 3, to: 4.5, step: 0.25 },
      cols: [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4],
      rounding: "down",
      familyId: 2,
    },
  ],
} as const;

/** Same clinical content (the staleness key), different full fingerprint. */
const wordingOnlyPair = (a: Snapshot, b: Snapshot) =>
  clinicalFingerprint(a) === clinicalFingerprint(b) && fingerprintOf(a) !== fingerprintOf(b) && wordingOnly(a, b);

const withCard = (card: unknown) => ({ ...twoLookups, card });
const issues = (input: unknown) => {
  const r = chartDefinitionSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
};

describe("the card in the chart definition", () => {
  it("is optional: a chart without it, or with null, has no card choice", () => {
    expect(chartDefinitionSchema.parse(twoLookups).card).toBeUndefined();
    expect(chartDefinitionSchema.parse(withCard(null)).card).toBeNull();
  });

  it("accepts a lookup per side with optional ranges on that lookup's axes", () => {
    const card = { sides: [{ lookup: 1, rows: [3.5, 4], cols: [3, 3.5] }, { lookup: 0 }] };
    expect(chartDefinitionSchema.parse(withCard(card)).card).toEqual(card);
    // An explicit axis list is an axis too.
    expect(issues(withCard({ sides: [{ lookup: 1, cols: [2.75, 2.75] }, { lookup: 1 }] }))).toEqual([]);
  });

  it("refuses a lookup the chart does not have, naming the side and the field", () => {
    expect(issues(withCard({ sides: [{ lookup: 0 }, { lookup: 2 }] }))).toEqual([
      { path: "card.sides.1.lookup", message: "Badge card side 2: the chart has no lookup 3 (it has 2 lookups)" },
    ]);
    expect(issues({ ...potDefinition, card: { sides: [{ lookup: 1 }, { lookup: 0 }] } })).toEqual([
      { path: "card.sides.0.lookup", message: "Badge card side 1: the chart has no lookup 2 (it has 1 lookup)" },
    ]);
    expect(issues(withCard({ sides: [{ lookup: -1 }, { lookup: 0 }] }))[0]?.path).toBe("card.sides.0.lookup");
    expect(issues(withCard({ sides: [{ lookup: 0.5 }, { lookup: 0 }] }))[0]?.path).toBe("card.sides.0.lookup");
  });

  it("refuses a range that runs backwards", () => {
    expect(issues(withCard({ sides: [{ lookup: 0, rows: [3.5, 3] }, { lookup: 1 }] }))).toEqual([
      {
        path: "card.sides.0.rows",
        message: 'Badge card side 1: the rows run from 3.50 mm to 3.00 mm; "from" must not be above "to"',
      },
    ]);
  });

  it("refuses values that are not on the chosen lookup's axis, each end on its own", () => {
    const found = issues(withCard({ sides: [{ lookup: 0 }, { lookup: 1, cols: [2.6, 4.25] }] }));
    expect(found.map((i) => i.path)).toEqual(["card.sides.1.cols.0", "card.sides.1.cols.1"]);
    expect(found[0]!.message).toBe(
      "Badge card side 2: 2.60 mm is not one of lookup 2's columns (2.50, 2.75, 3.00, 3.25, 3.50, 3.75, 4.00 mm)",
    );
    // 2.0 is on lookup 1's columns but not on lookup 2's: the side's own lookup decides.
    expect(
      issues(
        withCard({
          sides: [
            { lookup: 0, cols: [2, 2.5] },
            { lookup: 1, cols: [2, 2.5] },
          ],
        }),
      ),
    ).toEqual([expect.objectContaining({ path: "card.sides.1.cols.0" })]);
  });

  it("refuses other shapes: one side, three sides, unknown keys, a range of one value", () => {
    for (const card of [
      { sides: [{ lookup: 0 }] },
      { sides: [{ lookup: 0 }, { lookup: 1 }, { lookup: 0 }] },
      { sides: [{ lookup: 0, size: 3 }, { lookup: 1 }] },
      { sides: [{ lookup: 0, rows: [3] }, { lookup: 1 }] },
      { sides: [{ lookup: 0 }, { lookup: 1 }], extra: true },
      "lookup 1",
    ])
      expect(issues(withCard(card)).length, JSON.stringify(card)).toBeGreaterThan(0);
    expect(issues(withCard({ sides: [{ lookup: 0 }] }))[0]!.message).toMatch(/two sides/);
  });

  it("PATCH accepts a card or null; the merged chart is then checked whole", () => {
    expect(chartPatchSchema.parse({ card: null })).toEqual({ card: null });
    expect(chartPatchSchema.parse({ card: { sides: [{ lookup: 0 }, { lookup: 0 }] } }).card?.sides).toHaveLength(2);
    expect(chartPatchSchema.safeParse({ card: { sides: [] } }).success).toBe(false);
  });
});

describe("the card in the snapshot and its fingerprints", () => {
  const plain = snapshotOf(twoLookups);
  const chosen = snapshotOf(
    withCard({
      sides: [
        { lookup: 1, rows: [3.5, 4] },
        { lookup: 0, cols: [2.5, 3] },
      ],
    }),
  );

  it("is frozen typed, with only the keys a side sets, and absent when there is no choice", () => {
    expect(chosen.card).toEqual({
      sides: [
        { lookup: 1, rows: [3.5, 4] },
        { lookup: 0, cols: [2.5, 3] },
      ],
    });
    expect(Object.keys(chosen.card!.sides[0])).toEqual(["lookup", "rows"]);
    expect("card" in plain).toBe(false);
    expect("card" in snapshotOf(withCard(null))).toBe(false);
    // A chart without a choice keeps the fingerprint it had before the card could be chosen.
    expect(fingerprintOf(snapshotOf(withCard(null)))).toBe(fingerprintOf(plain));
  });

  it("cardSides reads the choice, else lookup 1 then 2, or lookup 1 twice", () => {
    expect(cardSides(chosen)).toEqual(chosen.card!.sides);
    expect(cardSides(plain)).toEqual([{ lookup: 0 }, { lookup: 1 }]);
    expect(cardSides(snapshotOf(potDefinition))).toEqual([{ lookup: 0 }, { lookup: 0 }]);
  });

  it("the card grid of a chosen side keeps the chosen lookup's chosen rows and columns, cells unchanged", () => {
    const grids = snapshotGrids(chosen);
    const [front, back] = cardSides(chosen);
    const g = cardGrid(grids[front.lookup]!, front);
    expect(g.kind).toBe("side");
    expect(g.rowAxis.values).toEqual([3.5, 3.75, 4]);
    const full = grids[1]!;
    expect(g.cells[0]).toEqual(full.cells[full.rowAxis.values.indexOf(3.5)]!.slice(0, g.colAxis.values.length));
    const b = cardGrid(grids[back.lookup]!, back);
    expect(b.kind).toBe("proximal");
    expect(b.colAxis.values).toEqual([2.5, 2.75, 3]);
  });

  it("is wording: a changed card choice changes the fingerprint but not the clinical part", () => {
    expect(fingerprintOf(chosen)).not.toBe(fingerprintOf(plain));
    expect(wordingOnlyPair(plain, chosen)).toBe(true);
    const other = snapshotOf(withCard({ sides: [{ lookup: 0 }, { lookup: 1, cols: [3, 3.5] }] }));
    expect(wordingOnlyPair(chosen, other)).toBe(true);
    expect(describeChanges(chosen, other)).toEqual([{ kind: "layout", detail: "The badge card's sides changed" }]);
    expect(describeChanges(plain, plain)).toEqual([]);
  });

  it("the audit log names the sides in words, lookups counted from 1", () => {
    expect(
      describeDetail({
        before: { title: "t" },
        after: { title: "t", card: { sides: [{ lookup: 1, rows: [3.5, 4] }, { lookup: 0 }] } },
      }),
    ).toEqual([
      {
        label: "Badge card",
        before: "none",
        after: "side 1: lookup 2, rows 3.5 to 4 mm, all columns; side 2: lookup 1, all rows, all columns",
      },
    ]);
  });
});

describe("what the designer says about a side", () => {
  const pot = chartDefinitionSchema.parse(twoLookups).lookups[0]!;
  const cap = cardCapacity(false);

  it("plans the whole axis by default and the chosen range when there is one", () => {
    const whole = planCardSide(pot, { lookup: 0 })!;
    expect(whole.capacity).toEqual(cap);
    expect(whole.rows.axis).toEqual([2.5, 2.75, 3, 3.25, 3.5, 3.75, 4]);
    expect(whole.rows.chosen).toEqual(whole.rows.axis);
    const narrow = planCardSide(pot, { lookup: 0, rows: [3, 3.5], cols: [2.25, 2.25] })!;
    expect(narrow.rows.chosen).toEqual([3, 3.25, 3.5]);
    expect(narrow.rows.printed).toEqual([3, 3.25, 3.5]);
    expect(narrow.cols.printed).toEqual([2.25]);
    expect(axisSentence(narrow.rows, "rows")).toBe("Prints all 3 rows (3.0–3.5 mm).");
    expect(axisSentence(narrow.cols, "columns")).toBe("Prints all 1 column (2.25 mm).");
  });

  it("says plainly when a range is wider than fits, and which middle part prints", () => {
    expect(cap.rows).toBeLessThan(7);
    const plan = planCardSide(pot, { lookup: 0 })!;
    const printed = plan.rows.printed;
    expect(printed).toHaveLength(cap.rows);
    // The middle: as many dropped below as above, the odd one above.
    const below = plan.rows.axis.indexOf(printed[0]!);
    const above = plan.rows.axis.length - 1 - plan.rows.axis.indexOf(printed[printed.length - 1]!);
    expect(above - below).toBeGreaterThanOrEqual(0);
    expect(above - below).toBeLessThanOrEqual(1);
    const first = printed[0]!.toFixed(2).replace(/0$/, "");
    const last = printed[printed.length - 1]!.toFixed(2).replace(/0$/, "");
    expect(axisSentence(plan.rows, "rows")).toBe(
      `Too wide: 7 rows (2.5–4.0 mm) are chosen but ${cap.rows} fit, so the card prints the middle ${cap.rows}: ${first}–${last} mm.`,
    );
    expect(capacitySentence(plan)).toBe(`Legible at 40 cm: up to ${cap.rows} rows × ${cap.cols} columns.`);
  });

  it("fits fewer rows when cells carry a pressure line (reach by pressure)", () => {
    const reach = planCardSide({ ...pot, rounding: "reach" }, { lookup: 0 })!;
    expect(reach.capacity.rows).toBeLessThan(cap.rows);
    expect(reach.capacity).toEqual(cardCapacity(true));
  });

  it("has no plan while the lookup's axis is unusable", () => {
    expect(planCardSide({ ...pot, rows: { from: 3, to: 2, step: 0.25 } }, { lookup: 0 })).toBeNull();
  });

  it("keeps sides on their lookups when a lookup is removed", () => {
    const card = {
      sides: [
        { lookup: 2, rows: [3, 3.5] as [number, number] },
        { lookup: 1, cols: [2, 3] as [number, number] },
      ],
    } as const;
    expect(cardAfterRemovingLookup({ sides: [card.sides[0], card.sides[1]] }, 0)).toEqual({
      sides: [
        { lookup: 1, rows: [3, 3.5] },
        { lookup: 0, cols: [2, 3] },
      ],
    });
    expect(cardAfterRemovingLookup({ sides: [card.sides[0], card.sides[1]] }, 1)).toEqual({
      sides: [{ lookup: 1, rows: [3, 3.5] }, { lookup: 0 }],
    });
    expect(cardAfterRemovingLookup(null, 0)).toBeNull();
    expect(shownCardSides(undefined, 1)).toEqual([{ lookup: 0 }, { lookup: 0 }]);
    expect(shownCardSides(undefined, 3)).toEqual([{ lookup: 0 }, { lookup: 1 }]);
  });
});
