import "server-only";
import { AppError, invalidInput } from "@/lib/errors";
import { formatExactMm, lawFormula, solve } from "@/lib/sizing";
import { parseSolveQuery, type QueryRecord } from "@/lib/validation/solve";

/** Public: two diameters and a law give the third. Holds no lab data, so anyone may call it. */
export function solveDiameters(query: QueryRecord) {
  const parsed = parseSolveQuery(query);
  if (!parsed.success) throw invalidInput(parsed.issues);
  const { spec, known } = parsed.data;
  const result = solve(spec, known);
  if (!result.ok) throw new AppError("no_solution", result.reason);
  return {
    law: spec.law,
    ...("ratio" in spec ? { ratio: spec.ratio } : {}),
    ...("n" in spec ? { n: spec.n } : {}),
    solved: result.solved,
    diameterMm: result.diameterMm,
    diameterLabel: formatExactMm(result.diameterMm),
    formula: lawFormula(spec),
    warnings: result.warnings,
  };
}
