// The bifurcation law a chart uses, with its parameter; on its own so laws.ts and fit.ts share it.
export type LawSpec =
  | { law: "finet"; ratio: number }
  | { law: "murray" }
  | { law: "huo-kassab" }
  | { law: "square" }
  | { law: "power"; n: number };
