import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { charts, labs } from "@/db/schema";
import type { Snapshot } from "@/lib/charts/snapshot";
import { snapshotLegibility } from "@/lib/poster/model";

afterAll(() => pool.end());

describe("the seeded demo charts", () => {
  it("each print figures that meet the 20′ guide at their own reading distance", async () => {
    const rows = await db
      .select({ title: charts.title, live: charts.liveSnapshot })
      .from(charts)
      .innerJoin(labs, eq(labs.id, charts.labId))
      .where(eq(labs.slug, "demo"));
    expect(rows.length).toBeGreaterThanOrEqual(3);
    for (const row of rows) {
      const legibility = snapshotLegibility(row.live as Snapshot, { status: "approved" });
      expect(legibility.ok, `${row.title}: ${legibility.suggestion}`).toBe(true);
    }
  });
});
