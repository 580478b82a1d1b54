import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, charts, editions, labs } from "@/db/schema";
import { gridJson } from "@/lib/charts/grid-model";
import type { Snapshot } from "@/lib/charts/snapshot";
import { snapshotLegibility } from "@/lib/poster/model";

afterAll(() => pool.end());

describe("the seeded demo charts", () => {
  it("each print figures that meet the 20′ guide at their own reading distance", async () => {
    const rows = await db
      .select({ title: charts.title, live: charts.liveSnapshot })
      .from(charts)
      .innerJoin(labs, eq(labs.id, charts.labId))
      .where(eq(labs.slug, "demo"));
    expect(rows.length).toBeGreaterThanOrEqual(3);
    for (const row of rows) {
      const legibility = snapshotLegibility(row.live as Snapshot, { status: "approved" });
      expect(legibility.ok, `${row.title}: ${legibility.suggestion}`).toBe(true);
    }
  });
});

/**
 * Every approved demo poster, re-checked here independently of the engine's own marks:
 * - stent limit: the POT balloon's diameter at rated burst pressure (nominal + the family's
 *   growth at RBP, as a compliance chart states it; common practice) against the lowest
 *   maximum post-dilatation diameter of every stent from the nearest nominal at or below the
 *   main branch to the nearest at or above it (common practice);
 * - rounding cap: 0.25 mm above, 0.5 mm below unless the chart sets its own (common practice);
 * - lookup rules: POT non-compliant, up/nearest/reach; side down/nearest; main nearest/down.
 * A hazard the poster prints without its mark fails this test.
 */
describe("the seeded approved posters carry no unmarked hazard", () => {
  it("every approved demo edition marks each stent-limit and cap breach and follows the lookup rules", async () => {
    const rows = await db
      .select({ title: charts.title, snapshot: editions.snapshot, labId: editions.labId })
      .from(editions)
      .innerJoin(charts, eq(charts.id, editions.chartId))
      .innerJoin(labs, eq(labs.id, editions.labId))
      .where(and(eq(labs.slug, "demo"), eq(editions.status, "approved")));
    expect(rows.length).toBeGreaterThanOrEqual(2);
    let checkedCells = 0;
    let hazards = 0;
    for (const row of rows) {
      const snapshot = row.snapshot as Snapshot;
      expect(snapshot.caution, row.title).toContain("invented and illustrative"); // the demo lab is flagged demo
      expect(JSON.stringify(snapshot), row.title).not.toMatch(/from memory/i);
      const json = gridJson(snapshot);
      const caps = snapshot.caps ?? { upMm: 0.25, downMm: 0.5 };
      for (const [i, lookup] of json.lookups.entries()) {
        const family = snapshot.lookups[i]!.family!;
        const [fam] = await db
          .select({ compliance: balloonFamilies.compliance })
          .from(balloonFamilies)
          .where(eq(balloonFamilies.id, lookup.familyId!));
        const allowed = { proximal: ["up", "nearest", "reach"], side: ["down", "nearest"], main: ["nearest", "down"] };
        expect(allowed[lookup.kind], `${row.title}: rounding`).toContain(lookup.rounding);
        if (lookup.kind === "proximal") expect(fam!.compliance, `${row.title}: POT family`).toBe("nc");
        if (lookup.rounding === "reach") expect(family.growthAtRbpMm).toBeGreaterThan(0);
        lookup.cells.forEach((cells, r) =>
          cells.forEach((cell, c) => {
            const where = `${row.title} ${lookup.rows[r]} x ${lookup.cols[c]}`;
            if (cell.atm !== null) expect(cell.atm, where).toBeLessThanOrEqual(family.rbpAtm);
            if (cell.sizeMm === null || cell.exactMm === null) return;
            checkedCells++;
            const delivered =
              cell.atm === null
                ? cell.sizeMm
                : cell.sizeMm +
                  ((family.growthAtRbpMm ?? 0) * (cell.atm - family.nominalAtm)) / (family.rbpAtm - family.nominalAtm);
            if (delivered - cell.exactMm > caps.upMm + 1e-9) expect(cell.marks, where).toContain("oversize");
            if (cell.exactMm - delivered > caps.downMm + 1e-9) expect(cell.marks, where).toContain("undersize");
            if (lookup.kind !== "proximal" || !snapshot.stent) return;
            const mb = lookup.rows[r]!;
            const atRbp = cell.sizeMm + (family.growthAtRbpMm ?? 0);
            const nominals = [...new Set(snapshot.stent.sizes.map((s) => s.nominalMm))].sort((a, b) => a - b);
            const above = nominals.find((n) => n >= mb - 0.01);
            const below = [...nominals].reverse().find((n) => n <= mb + 0.01) ?? above;
            const limits = snapshot.stent.sizes
              .filter((s) => above !== undefined && s.nominalMm >= below! && s.nominalMm <= above)
              .map((s) => s.maxPostDilatationMm);
            if (limits.length === 0 || atRbp > Math.min(...limits) + 0.01) {
              hazards++;
              expect(cell.marks, where).toContain("stent-limit");
            }
          }),
        );
      }
    }
    expect(checkedCells).toBeGreaterThan(30);
    expect(hazards).toBeGreaterThan(0); // the POT poster has real hazards, so the check is not vacuous
  });
});
