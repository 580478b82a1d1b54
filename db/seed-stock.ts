// Demo stock. Every family, platform, pressure and limit here is INVENTED for illustration: no
// real device, brand or manufacturer's data. Idempotent: a family or platform that already
// exists (by name) is left exactly as the lab has it.
import { and, eq, sql } from "drizzle-orm";
import type { Database } from "./index";
import { balloonFamilies, balloons, labs, stentPlatforms, stentSizes } from "./schema";

type SeedFamily = {
  name: string;
  compliance: "nc" | "sc";
  nominalAtm: number;
  rbpAtm: number;
  growthAtRbpMm: number | null;
  diameters: number[];
  outOfStock: number[];
};
type SeedPlatform = { name: string; sizes: [nominalMm: number, maxPostDilatationMm: number][] };

const range = (from: number, to: number, step: number) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => Number((from + i * step).toFixed(2)));

export const DEMO_STOCK: Record<string, { families: SeedFamily[]; platforms: SeedPlatform[] }> = {
  demo: {
    families: [
      {
        name: "NC family A (illustrative)",
        compliance: "nc",
        nominalAtm: 12,
        rbpAtm: 20,
        growthAtRbpMm: 0.2,
        diameters: range(2, 5, 0.25),
        outOfStock: [3.25, 4.75],
      },
      {
        name: "SC family B (illustrative)",
        compliance: "sc",
        nominalAtm: 8,
        rbpAtm: 14,
        growthAtRbpMm: null,
        diameters: range(1.5, 4, 0.25),
        outOfStock: [],
      },
    ],
    platforms: [
      {
        name: "DES platform X (illustrative)",
        sizes: [
          [2.25, 3.5],
          [2.5, 3.5],
          [2.75, 3.5],
          [3, 4.5],
          [3.5, 4.5],
          [4, 4.5],
        ],
      },
      {
        name: "DES platform Y (illustrative)",
        sizes: [
          [2.5, 4],
          [2.75, 4],
          [3, 4],
          [3.5, 5.5],
          [4, 5.5],
          [4.5, 6],
          [5, 6],
        ],
      },
    ],
  },
  "demo-north": {
    families: [
      {
        name: "NC family C (illustrative)",
        compliance: "nc",
        nominalAtm: 14,
        rbpAtm: 22,
        growthAtRbpMm: 0.15,
        diameters: range(2.5, 4, 0.5),
        outOfStock: [],
      },
    ],
    platforms: [
      {
        name: "DES platform Z (illustrative)",
        sizes: [
          [2.5, 3.5],
          [3, 4.5],
          [3.5, 4.5],
        ],
      },
    ],
  },
};

/** Seeds the invented demo stock into labs that lack it; bumps the lab's stock revision once if anything was added. */
export async function seedDemoStock(db: Database, labIds: Map<string, number>): Promise<void> {
  for (const [slug, stock] of Object.entries(DEMO_STOCK)) {
    const labId = labIds.get(slug);
    if (!labId) continue;
    let added = false;
    for (const fam of stock.families) {
      const [found] = await db
        .select({ id: balloonFamilies.id })
        .from(balloonFamilies)
        .where(and(eq(balloonFamilies.labId, labId), eq(balloonFamilies.name, fam.name)));
      if (found) continue;
      const { diameters, outOfStock, ...values } = fam;
      const [row] = await db
        .insert(balloonFamilies)
        .values({ labId, ...values })
        .$returningId();
      await db
        .insert(balloons)
        .values(diameters.map((d) => ({ labId, familyId: row!.id, diameterMm: d, inStock: !outOfStock.includes(d) })));
      added = true;
    }
    for (const plat of stock.platforms) {
      const [found] = await db
        .select({ id: stentPlatforms.id })
        .from(stentPlatforms)
        .where(and(eq(stentPlatforms.labId, labId), eq(stentPlatforms.name, plat.name)));
      if (found) continue;
      const [row] = await db.insert(stentPlatforms).values({ labId, name: plat.name }).$returningId();
      await db.insert(stentSizes).values(
        plat.sizes.map(([nominalMm, maxPostDilatationMm]) => ({
          labId,
          platformId: row!.id,
          nominalMm,
          maxPostDilatationMm,
        })),
      );
      added = true;
    }
    if (added)
      await db
        .update(labs)
        .set({ stockRevision: sql`${labs.stockRevision} + 1` })
        .where(eq(labs.id, labId));
  }
}
