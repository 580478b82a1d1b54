// The lab's rules bind when a chart is created or changed, not only at approval: a breach answers
// 400 naming the rule unless the medical lead recorded an exception for that chart and rule.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, balloons } from "@/db/schema";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import * as rulesOps from "@/lib/ops/lab-rules";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { addMember, createUser, labWithTeam, stentPlatformFor } from "./support/fixtures";
import { as, type Person } from "../support/roles";
import { refusal } from "../support/refusal";

let team: Awaited<ReturnType<typeof labWithTeam>>;
// Four eyes: whoever records an exception for a chart does not approve its next edition.
let secondLead: Person;
let familyId = 0;
let stentId = 0;

const definition = (over: object = {}) =>
  chartDefinitionSchema.parse({
    title: "Rules bind",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
    ...over,
  });

beforeAll(async () => {
  team = await labWithTeam();
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC bind", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  familyId = fam!.id;
  await db
    .insert(balloons)
    .values([2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25].map((d) => ({ labId: team.lab.id, familyId, diameterMm: d })));
  stentId = await stentPlatformFor(team.lab.id);
  secondLead = await createUser("lead-two");
  await addMember(team.lab.id, secondLead.id, "lead");
});

afterAll(() => pool.end());

describe("rules bind at every step", () => {
  const lab = () => ({ lab: team.lab.slug });
  const cases: [string, object, string, (string | number)[]][] = [
    // Default exponent range 2 to 3: between the square law and Murray's law (common practice).
    [
      "power-law exponent outside the lab's range",
      { law: { law: "power", n: 1.6 } },
      "power-law exponent range",
      ["law", "n"],
    ],
    [
      "power-law exponent above the lab's range",
      { law: { law: "power", n: 3.2 } },
      "power-law exponent range",
      ["law", "n"],
    ],
    // Default caps 0.25 mm up (common practice).
    ["caps above the lab's", { roundingCaps: { upMm: 0.5, downMm: 0.5 } }, "rounding caps", ["roundingCaps", "upMm"]],
    [
      "POT without a stent platform",
      { stentPlatformId: null },
      "POT checked against a stent platform",
      ["stentPlatformId"],
    ],
  ];
  for (const [what, over, rule, path] of cases)
    it(`creating a chart with ${what} is refused (400) naming the rule`, async () => {
      const err = await refusal(chartOps.createChart(as(team.people.educator), lab(), definition(over)));
      expect(err.status).toBe(400);
      expect(err.message).toContain(`Lab rule "${rule}"`);
      expect(err.issues).toContainEqual(expect.objectContaining({ path }));
    });

  it("changing a chart is checked too; an exception for that chart and rule lets the change through, and it prints", async () => {
    const { id: chartId } = await chartOps.createChart(as(team.people.educator), lab(), definition());
    const wide = definition({ roundingCaps: { upMm: 0.5, downMm: 0.5 } });
    const err = await refusal(chartOps.saveChart(as(team.people.educator), { chartId }, wide));
    expect(err.status).toBe(400);
    expect(err.message).toContain('Lab rule "rounding caps"');
    await rulesOps.setLabRules(as(team.people.lead), lab(), {
      exceptions: [{ chartId, rule: "caps", reason: "Stock gap accepted (illustrative)" }],
    });
    await chartOps.saveChart(as(team.people.educator), { chartId }, wide);
    // The other rules still bind this chart.
    const power = await refusal(
      chartOps.saveChart(as(team.people.educator), { chartId }, { ...wide, law: { law: "power", n: 1.6 } }),
    );
    expect(power.message).toContain("power-law exponent range");
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const approved = await ops.approveEdition(as(secondLead), { editionId: ed.id }, { reviewed: true });
    expect(approved.status).toBe("approved");
  });

  it("a no-stent-check exception lets a POT chart drop its stent platform; approval then goes through", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      lab(),
      definition({ title: "No DES" }),
    );
    const bare = definition({ title: "No DES", stentPlatformId: null });
    expect((await refusal(chartOps.saveChart(as(team.people.educator), { chartId }, bare))).status).toBe(400);
    const rules = await rulesOps.getLabRules(as(team.people.lead), lab());
    await rulesOps.setLabRules(as(team.people.lead), lab(), {
      exceptions: [
        ...rules.exceptions.map(({ chartId, rule, reason }) => ({ chartId, rule, reason })),
        { chartId, rule: "no-stent-check", reason: "Balloon-only room (illustrative)" },
      ],
    });
    await chartOps.saveChart(as(team.people.educator), { chartId }, bare);
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    expect((await ops.approveEdition(as(secondLead), { editionId: ed.id }, { reviewed: true })).status).toBe(
      "approved",
    );
  });
});
