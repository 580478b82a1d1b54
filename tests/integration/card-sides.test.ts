// The badge card's sides as a client sets them on MariaDB: PATCH refuses a card that names a
// missing lookup or a value off its axis (400 naming the field, nothing stored) and refuses
// operators (403); a new card choice is wording, so a posted copy stays current and names the
// edition that carries it; and that edition's card prints exactly the chosen rows and columns.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, balloons, charts, editions } from "@/db/schema";
import type { Snapshot } from "@/lib/charts/snapshot";
import type { CheckJson } from "@/lib/editions/check-json";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { GET as pdfRoute } from "@/app/api/v1/editions/[id]/pdf/route";
import { GET as checkRoute } from "@/app/api/v1/check/[token]/route";
import { cardHeadings } from "@/tests/support/card-headings";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { call } from "../support/routes";
import { createChart } from "./support/writes";
import { as } from "../support/roles";
import { signOffSteps } from "./support/sign-off";

vi.mock("@/lib/auth/session", () => import("../support/session"));

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let chartId = 0;

type ErrorBody = { error: { message: string; issues?: { path: (string | number)[]; message: string }[] } };

const patch = (body: unknown) => call(patchChartRoute, { id: String(chartId) }, "PATCH", body);
const storedDefinition = async () =>
  (await db.select({ d: charts.definition }).from(charts).where(eq(charts.id, chartId)))[0]!.d as Record<
    string,
    unknown
  >;
const { approvedEdition } = signOffSteps(
  () => team.people,
  () => chartId,
);
const editionRow = async (id: number) => (await db.select().from(editions).where(eq(editions.id, id)))[0]!;
async function check(id: number) {
  as(null);
  const res = await call(checkRoute, { token: (await editionRow(id)).checkToken }, "GET");
  expect(res.status).toBe(200);
  return (await res.json()) as CheckJson;
}

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [nc] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC card", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  const [sc] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "SC card", compliance: "sc", nominalAtm: 8, rbpAtm: 14, growthAtRbpMm: 0.3 })
    .$returningId();
  const sizes = (from: number, to: number) =>
    Array.from({ length: Math.round((to - from) / 0.25) + 1 }, (_, i) => from + i * 0.25);
  await db
    .insert(balloons)
    .values([
      ...sizes(2, 5).map((d) => ({ labId: team.lab.id, familyId: nc!.id, diameterMm: d })),
      ...sizes(1.5, 4).map((d) => ({ labId: team.lab.id, familyId: sc!.id, diameterMm: d })),
    ]);
  const definition = chartDefinitionSchema.parse({
    title: "Card sides chart",
    law: { law: "square" },
    lookups: [
      { kind: "proximal", familyId: nc!.id, rounding: "up", rows: { from: 2.5, to: 4, step: 0.25 }, cols: [2, 2.5, 3] },
      {
        kind: "side",
        familyId: sc!.id,
        rounding: "down",
        rows: { from: 3, to: 4.5, step: 0.25 },
        cols: [2.5, 3, 3.5, 4],
      },
    ],
    stentPlatformId: stentId,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1,
  });
  chartId = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition })).id;
});

afterAll(() => pool.end());

describe("the badge card's sides through PATCH /api/v1/charts/:id", () => {
  it("refuses a missing lookup, a backwards range and values off the axis with 400 naming the field; nothing is stored", async () => {
    const before = await storedDefinition();
    as(team.people.educator);
    for (const [card, path, words] of [
      [{ sides: [{ lookup: 0 }, { lookup: 2 }] }, "card.sides.1.lookup", "the chart has no lookup 3"],
      [{ sides: [{ lookup: 1, rows: [4, 3.5] }, { lookup: 0 }] }, "card.sides.0.rows", '"from" must not be above "to"'],
      [{ sides: [{ lookup: 0 }, { lookup: 1, cols: [2.5, 3.25] }] }, "card.sides.1.cols.1", "3.25 mm is not one of"],
      [{ sides: [{ lookup: 0 }] }, "card.sides", "two sides"],
    ] as const) {
      const res = await patch({ card });
      expect(res.status, path).toBe(400);
      const body = (await res.json()) as ErrorBody;
      expect(
        body.error.issues?.map((i) => i.path.join(".")),
        path,
      ).toContain(path);
      expect(body.error.message, path).toContain(words);
    }
    expect(await storedDefinition()).toEqual(before);
  });

  it("is the chart designers' to change: an operator gets 403 and nothing changes", async () => {
    const before = await storedDefinition();
    as(team.people.operator);
    expect((await patch({ card: { sides: [{ lookup: 1 }, { lookup: 0 }] } })).status).toBe(403);
    expect(await storedDefinition()).toEqual(before);
  });

  it("a new card choice keeps the posted copy current and names the edition carrying it, whose card prints the chosen range", async () => {
    const first = await approvedEdition();
    expect(await check(first)).toMatchObject({ status: "current", reworded: false });

    as(team.people.educator);
    const card = {
      sides: [
        { lookup: 0, rows: [3, 3.5] },
        { lookup: 1, rows: [3.5, 4], cols: [3, 3.5] },
      ],
    };
    const res = await patch({ card });
    expect(res.status).toBe(200);
    expect((await storedDefinition()).card).toEqual(card);
    expect(await check(first)).toMatchObject({ status: "current", action: "keep", reworded: false });

    const second = await approvedEdition();
    expect(await check(first)).toMatchObject({
      status: "current",
      action: "keep",
      reworded: true,
      rewordedEdition: { number: 2, status: "approved" },
    });
    const snapshot = (await editionRow(second)).snapshot as Snapshot;
    expect(snapshot.card).toEqual(card);

    as(team.people.operator);
    const pdf = await call(pdfRoute, { id: String(second) }, "GET", undefined, "?format=card");
    expect(pdf.status).toBe(200);
    const [front, back] = cardHeadings(Buffer.from(await pdf.arrayBuffer()), snapshot);
    expect(front).toEqual({ rows: ["3.0", "3.25", "3.5"], cols: ["2.0", "2.5", "3.0"] });
    expect(back).toEqual({ rows: ["3.5", "3.75", "4.0"], cols: ["3.0", "3.5"] });

    // null clears the choice: back to lookup 1 then 2, and still only wording.
    as(team.people.educator);
    expect((await patch({ card: null })).status).toBe(200);
    expect(await check(first)).toMatchObject({ status: "current", action: "keep" });
  });
});
