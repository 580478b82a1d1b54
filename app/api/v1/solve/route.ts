import { api } from "@/lib/http/route";
import { solveDiameters } from "@/lib/ops/solve";
import { queryRecord } from "@/lib/validation/solve";

// Public: it holds no lab data.
export const GET = api(async ({ req }) => solveDiameters(queryRecord(new URL(req.url).searchParams)), { public: true });
