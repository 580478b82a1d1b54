import { route } from "@/lib/auth/guard";
import { AppError, invalidInput } from "@/lib/errors";
import { formatExactMm, lawFormula, solve } from "@/lib/sizing";
import { parseSolveQuery, queryRecord } from "@/lib/validation/solve";

// Public: it holds no lab data.
export const GET = route(async (req) => {
  const parsed = parseSolveQuery(queryRecord(new URL(req.url).searchParams));
  if (!parsed.success) throw invalidInput(parsed.issues);
  const { spec, known } = parsed.data;
  const result = solve(spec, known);
  if (!result.ok) throw new AppError("no_solution", result.reason);
  return Response.json({
    law: spec.law,
    ...("ratio" in spec ? { ratio: spec.ratio } : {}),
    ...("n" in spec ? { n: spec.n } : {}),
    solved: result.solved,
    diameterMm: result.diameterMm,
    diameterLabel: formatExactMm(result.diameterMm),
    formula: lawFormula(spec),
    warnings: result.warnings,
  });
});
