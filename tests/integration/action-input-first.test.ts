import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { charts } from "@/db/schema";
import { labWithSmallChart } from "./support/writes";
import { as } from "../support/roles";

// Who is calling is the one thing stood in for; revalidatePath is the framework's cache, which
// here throws on a path it cannot encode as the real one does.
vi.mock("@/lib/auth/session", () => import("../support/session"));
vi.mock("next/cache", () => ({
  revalidatePath: (p: string) => void encodeURI(p),
  revalidateTag: () => {},
}));

const { archiveChartAction, restoreChartAction, saveChartAction } =
  await import("@/app/(lab)/labs/[slug]/charts/actions");

let fixture: Awaited<ReturnType<typeof labWithSmallChart>>;
const state = async () =>
  (
    await db.select({ d: charts.definition, a: charts.archivedAt }).from(charts).where(eq(charts.id, fixture.chartId))
  )[0]!;

beforeAll(async () => {
  fixture = await labWithSmallChart({ name: "Input first" });
  as(fixture.team.people.educator);
});
afterAll(() => pool.end());

describe("a server action validates its whole input before it writes", () => {
  it("saveChartAction with a lone surrogate in slug answers a form error and changes nothing", async () => {
    const before = await state();
    const definition = { ...(before.d as Record<string, unknown>), title: "Renamed by a broken request" };
    const res = await saveChartAction(
      {},
      { slug: `${fixture.team.lab.slug}\uD800`, chartId: fixture.chartId, definition },
    );
    expect(res.ok).toBe(false);
    expect(res.fieldErrors?.slug).toMatch(/broken character/);
    expect(await state()).toEqual(before);
  });

  it("restoreChartAction with a lone surrogate in slug changes nothing", async () => {
    as(fixture.team.people.manager);
    expect((await archiveChartAction({}, { slug: fixture.team.lab.slug, chartId: fixture.chartId })).ok).toBe(true);
    const before = await state();
    expect(before.a).not.toBeNull();
    const res = await restoreChartAction({}, { slug: `\uDC00${fixture.team.lab.slug}`, chartId: fixture.chartId });
    expect(res.ok).toBe(false);
    expect(await state()).toEqual(before);
  });

  it("a lone surrogate deep inside the payload is named by its path", async () => {
    const res = await saveChartAction({}, { slug: fixture.team.lab.slug, definition: { notes: ["ok", "bad\uDBFF"] } });
    expect(res.ok).toBe(false);
    expect(Object.keys(res.fieldErrors ?? {})).toEqual(["definition.notes.1"]);
  });
});
