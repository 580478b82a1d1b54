import { pool } from "@/db";
import { healthResponse } from "@/db/health";

export const dynamic = "force-dynamic";

export function GET() {
  return healthResponse(pool);
}
