import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { wordingOnly } from "@/lib/charts/clinical";
import { clinicalFingerprint, fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot, type Snapshot } from "@/lib/charts/snapshot";
import { diffCells, printedCells } from "@/lib/editions/diff";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, potDefinition, snapshotOf } from "../../support/poster-fixtures";

const pot = () => snapshotOf(potDefinition);
const withStock = (outOfStock: number[], def: Parameters<typeof snapshotOf>[0] = potDefinition): Snapshot =>
  buildSnapshot({
    labName: "Illustrative Cath Lab (demo)",
    definition: chartDefinitionSchema.parse(def),
    stock: {
      ...demoStock,
      balloonFamilies: demoStock.balloonFamilies.map((f) => ({
        ...f,
        balloons: f.balloons.map((b) => ({ ...b, inStock: b.inStock && !outOfStock.includes(b.diameterMm) })),
      })),
    },
    logoSha256: null,
  });

describe("diffCells", () => {
  it("lists every printed cell with before null when nothing is replaced", () => {
    const after = pot();
    const cells = diffCells(null, after);
    expect(cells).toHaveLength(7 * 7);
    expect(cells.every((c) => c.before === null && c.after !== null)).toBe(true);
    expect(cells[0]).toMatchObject({ lookup: "proximal", row: 2.5, col: 2 });
  });

  it("is empty for the same snapshot and for a wording-only change", () => {
    expect(diffCells(pot(), pot())).toEqual([]);
    expect(diffCells(pot(), snapshotOf({ ...potDefinition, notes: "Reworded notes", title: "New title" }))).toEqual([]);
  });

  it("names exactly the cells whose printed size changes when a size leaves stock", () => {
    const before = pot();
    const after = withStock([3.5]);
    const cells = diffCells(before, after);
    const b = printedCells(before);
    const a = printedCells(after);
    const changed = [...a.keys()].filter((k) => JSON.stringify(a.get(k)!.cell) !== JSON.stringify(b.get(k)!.cell));
    expect(cells.length).toBeGreaterThan(0);
    expect(cells.length).toBe(changed.length);
    for (const c of cells) {
      expect(c.before).not.toBeNull();
      expect(c.after).not.toBeNull();
      expect(c.before!.printed === "3.5" || c.before!.marks.join() !== c.after!.marks.join()).toBe(true);
      expect(c.after!.printed).not.toBe("3.5");
    }
  });

  it("lists cells of a removed axis value with after null and of a new one with before null", () => {
    const narrower = snapshotOf({
      ...potDefinition,
      lookups: [{ ...potDefinition.lookups[0], cols: { from: 2.25, to: 3.75, step: 0.25 } }],
    });
    const cells = diffCells(pot(), narrower);
    expect(cells.filter((c) => c.col === 2).every((c) => c.after === null && c.before !== null)).toBe(true);
    expect(cells.filter((c) => c.col === 2)).toHaveLength(7);
    expect(cells.filter((c) => c.col === 3.75).every((c) => c.before === null && c.after !== null)).toBe(true);
    expect(cells.filter((c) => c.col === 3.75)).toHaveLength(7);
  });

  it("carries the marks the poster prints", () => {
    const cells = diffCells(null, pot());
    expect(cells.some((c) => c.after!.marks.includes("not-bifurcation") && c.after!.printed === "—")).toBe(true);
  });
});

describe("clinical fingerprint", () => {
  it("keeps the clinical fingerprint when only notes, title or logo change", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), fc.string({ minLength: 1, maxLength: 80 }), (notes, title) => {
        const a = pot();
        const b: Snapshot = { ...a, notes, title, logoSha256: "ab".repeat(32) };
        expect(clinicalFingerprint(b)).toBe(clinicalFingerprint(a));
      }),
    );
    const reworded = { ...pot(), notes: "Something else" };
    expect(fingerprintOf(reworded)).not.toBe(fingerprintOf(pot()));
    expect(wordingOnly(pot(), reworded)).toBe(true);
    expect(wordingOnly(pot(), pot())).toBe(false);
  });

  it("changes the clinical fingerprint for any size leaving stock that a cell can reach", () => {
    const base = pot();
    const sizes = base.lookups[0]!.family!.diameters;
    fc.assert(
      fc.property(fc.constantFrom(...sizes), (size) => {
        expect(clinicalFingerprint(withStock([size]))).not.toBe(clinicalFingerprint(base));
      }),
    );
  });

  it("changes it for a law, axis, pressure or stent change", () => {
    const base = clinicalFingerprint(pot());
    expect(clinicalFingerprint(snapshotOf({ ...potDefinition, law: { law: "murray" } }))).not.toBe(base);
    expect(
      clinicalFingerprint(
        snapshotOf({
          ...potDefinition,
          lookups: [{ ...potDefinition.lookups[0], rows: { from: 2.5, to: 4.25, step: 0.25 } }],
        }),
      ),
    ).not.toBe(base);
    const p = pot();
    const f = p.lookups[0]!.family!;
    expect(
      clinicalFingerprint({ ...p, lookups: [{ ...p.lookups[0]!, family: { ...f, rbpAtm: f.rbpAtm + 1 } }] }),
    ).not.toBe(base);
    expect(clinicalFingerprint({ ...p, stent: null })).not.toBe(base);
  });
});
