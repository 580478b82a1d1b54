// Invented, illustrative stock and charts for poster tests and the benchmark only.
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot, type LabStock, type Snapshot } from "@/lib/charts/snapshot";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import type { PosterInput } from "@/lib/poster/pdf/document";

const steps = (from: number, to: number, step = 0.25) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => Math.round((from + i * step) * 100) / 100);

export const demoStock: LabStock = {
  balloonFamilies: [
    {
      id: 1,
      name: "Illustrative NC balloon",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: 0.25,
      balloons: steps(2, 5).map((d) => ({ diameterMm: d, inStock: d !== 4.75 })),
    },
    {
      id: 2,
      name: "Illustrative SC balloon",
      compliance: "sc",
      nominalAtm: 8,
      rbpAtm: 14,
      growthAtRbpMm: 0.35,
      balloons: steps(1.5, 4).map((d) => ({ diameterMm: d, inStock: true })),
    },
  ],
  stentPlatforms: [
    {
      id: 7,
      name: "Illustrative DES",
      sizes: [
        { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
        { nominalMm: 3, maxPostDilatationMm: 4.25 },
        { nominalMm: 3.5, maxPostDilatationMm: 4.5 },
        { nominalMm: 4, maxPostDilatationMm: 5 },
      ],
    },
  ],
};

type Definition = Parameters<typeof chartDefinitionSchema.parse>[0];

export function snapshotOf(definition: Definition, labName = "Illustrative Cath Lab (demo)"): Snapshot {
  return buildSnapshot({
    labName,
    definition: chartDefinitionSchema.parse(definition),
    stock: demoStock,
    logoSha256: null,
  });
}

/** The illustrative POT chart: Finet, A2 portrait, MB 2.5-4.0 x SB 2.0-3.5, NC family, stent platform. */
export const potDefinition = {
  title: "POT balloon chart (illustrative)",
  law: { law: "finet", ratio: 0.678 },
  lookups: [
    {
      kind: "proximal",
      rows: { from: 2.5, to: 4, step: 0.25 },
      cols: { from: 2, to: 3.5, step: 0.25 },
      rounding: "up",
      familyId: 1,
    },
  ],
  stentPlatformId: 7,
  paper: "A2",
  orientation: "portrait",
  readingDistanceM: 1.5,
  notes:
    "Illustrative demo chart with invented stock. Measure the distal main branch and the side branch at their reference segments.",
} as const;

/** The illustrative kissing chart: square law, Tabloid landscape, side-branch lookup. */
export const kissingDefinition = {
  title: "Side-branch kissing balloon (illustrative)",
  law: { law: "square" },
  lookups: [
    {
      kind: "side",
      rows: { from: 3, to: 4.5, step: 0.25 },
      cols: { from: 2.5, to: 4, step: 0.25 },
      rounding: "down",
      familyId: 2,
    },
  ],
  stentPlatformId: null,
  paper: "TABLOID",
  orientation: "landscape",
  readingDistanceM: 1,
  notes: "",
} as const;

export function posterInput(snapshot: Snapshot, edition: Partial<PosterInput["edition"]> = {}): PosterInput {
  return {
    snapshot,
    edition: {
      number: 3,
      status: "approved",
      approvedAt: new Date(Date.UTC(2026, 2, 2, 9, 30)),
      approvedByName: "Dr A. Example (illustrative)",
      fingerprint: fingerprintOf(snapshot),
      reviewBy: new Date(Date.UTC(2027, 2, 2, 9, 30)),
      checkUrl: "https://forkwall.example/v/7Qk2xB9mPq4tW8zR3nY6cH1d",
      shortCode: "K7QM-2XHD",
      codeUrl: "https://forkwall.example/c/K7QM-2XHD",
      ...edition,
    },
    logo: null,
  };
}
