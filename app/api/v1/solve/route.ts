import { limitPublic } from "@/lib/auth/public-limit";
import { addressOf } from "@/lib/auth/request-address";
import { api } from "@/lib/http/route";
import { solveDiameters } from "@/lib/ops/solve";
import { queryRecord } from "@/lib/validation/solve";

// Public: it holds no lab data; rate-limited per client address.
export const GET = api(
  async ({ req }) => {
    await limitPublic("solve", addressOf(req.headers));
    return solveDiameters(queryRecord(new URL(req.url).searchParams));
  },
  { public: true },
);
