import { api } from "@/lib/http/route";
import { calculatorLabs } from "@/lib/ops/calculator";

// The signed-in member's labs and their charts as they resolve today, loaded once by /calculator.
export const GET = api(({ caller }) => calculatorLabs(caller));
