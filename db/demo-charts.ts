// The demo lab's charts (invented, illustrative): their definitions, who approves them and where
// they hang. Pure data, so poster tests can lay them out without a database; db/seed-charts.ts
// writes them through the app's own write path.
export type DemoChart = {
  title: string;
  definition: (ids: { nc: number; sc: number; stent: number }) => unknown;
  approveBy: "lead" | "manager" | null;
  postIn: string[];
};

export const DEMO_CHARTS: DemoChart[] = [
  {
    title: "POT balloon chart (demo)",
    definition: ({ nc, stent }) => ({
      title: "POT balloon chart (demo)",
      law: { law: "finet", ratio: 0.678 },
      lookups: [
        {
          kind: "proximal",
          rows: { from: 2.5, to: 4, step: 0.25 },
          cols: { from: 2, to: 3.5, step: 0.25 },
          rounding: "up",
          familyId: nc,
        },
      ],
      stentPlatformId: stent,
      // A control-room wall is read from 2-3 m: A1 keeps the figures above the 20′ guide at 2.5 m.
      paper: "A1",
      orientation: "portrait",
      readingDistanceM: 2.5,
      notes:
        "Demo chart with invented stock. POT balloon sized 1:1 to the proximal main vessel; larger stocked size when between two.",
    }),
    approveBy: "lead",
    postIn: ["Procedure room 1", "Control room"],
  },
  {
    title: "Kissing balloon chart (demo)",
    // Huo-Kassab, not the square law: the square law's published fit is very asymmetric
    // bifurcations only (Huo et al. 2012), so on these diameters every cell would sit outside it.
    // A semi-compliant family, rounded down: side-branch rules (common practice).
    definition: ({ sc }) => ({
      title: "Kissing balloon chart (demo)",
      law: { law: "huo-kassab" },
      lookups: [
        {
          kind: "side",
          rows: { from: 3, to: 4.5, step: 0.25 },
          cols: { from: 2.5, to: 4, step: 0.25 },
          rounding: "down",
          familyId: sc,
        },
      ],
      stentPlatformId: null,
      paper: "A2",
      orientation: "portrait",
      readingDistanceM: 2,
      notes: "Demo chart with invented stock. Side-branch balloon: smaller stocked size when between two.",
    }),
    approveBy: "lead",
    postIn: ["Procedure room 2"],
  },
  {
    title: "Main-branch balloon chart (demo draft)",
    definition: ({ sc }) => ({
      title: "Main-branch balloon chart (demo draft)",
      law: { law: "huo-kassab" },
      lookups: [
        {
          kind: "main",
          rows: { from: 3, to: 4, step: 0.25 },
          cols: { from: 1.5, to: 2.75, step: 0.25 },
          rounding: "nearest",
          familyId: sc,
        },
      ],
      stentPlatformId: null,
      paper: "A2",
      orientation: "portrait",
      readingDistanceM: 2.5,
      notes: "",
    }),
    approveBy: null,
    postIn: [],
  },
];
