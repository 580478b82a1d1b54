// The lab's rules as the medical lead sets them: laws, rounding and caps per lookup kind, the
// exceptions recorded for one chart with a reason, the revision that refuses a stale change, and
// approval refused (naming the rule) for a chart outside them.
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { getEdition } from "@/db/queries/editions";
import { auditEvents, balloonFamilies, balloons, editions, labRules } from "@/db/schema";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import * as rulesOps from "@/lib/ops/lab-rules";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { as } from "../support/roles";
import { refusal } from "../support/refusal";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let other: Awaited<ReturnType<typeof labWithTeam>>;
let familyId = 0;

const definition = (title: string, law: object = { law: "murray" }) =>
  chartDefinitionSchema.parse({
    title,
    law,
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
  });

async function footprint() {
  const [a] = await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.labId, team.lab.id));
  const rules = await db.select().from(labRules).where(eq(labRules.labId, team.lab.id));
  return { audit: a!.n, rules };
}

const rulesAudit = async () =>
  (await db.select().from(auditEvents).where(eq(auditEvents.labId, team.lab.id))).filter(
    (e) => e.action === "lab.rules_updated",
  );

beforeAll(async () => {
  team = await labWithTeam();
  other = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC rules", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  familyId = fam!.id;
  await db
    .insert(balloons)
    .values([2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25].map((d) => ({ labId: team.lab.id, familyId, diameterMm: d })));
});

afterAll(() => pool.end());

describe("lab rules per lookup kind", () => {
  it("reads the defaults with revision 0: every law, the guardrail roundings, the default caps", async () => {
    const rules = await rulesOps.getLabRules(as(team.people.operator), { lab: team.lab.slug });
    expect(rules.revision).toBe(0);
    expect(rules.lookups.proximal).toEqual({
      laws: ["finet", "murray", "huo-kassab", "square", "power"],
      defaultLaw: { law: "finet", ratio: 0.678 },
      rounding: ["up", "nearest", "reach"],
      caps: { upMm: 0.25, downMm: 0.5 },
      // Between the square law and Murray's law (Huo et al., EuroIntervention 2012 compare both).
      powerRange: { min: 2, max: 3 },
      // Common practice, no published source: a reach pressure within 1 atm of rated burst pressure is marked.
      rbpHeadroomAtm: 1,
    });
    expect(rules.exceptions).toEqual([]);
  });

  it("bad input is 400 naming the field, a stale revision 409, and neither changes anything", async () => {
    const before = await footprint();
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("Bad"),
    );
    // A chart id of no chart in this lab (another lab's, or none) is refused like an unknown one.
    const foreignChart = chartId + 1_000_000;
    const after = await footprint();
    const bad: [unknown, string][] = [
      [{ lookups: { proximal: { laws: ["murray"], colour: "red" } } }, "colour"],
      [{ lookups: { side: { rounding: ["up"] } } }, "lookups.side.rounding.0"],
      [{ lookups: { proximal: { laws: ["murray"] } } }, "lookups.proximal.defaultLaw"],
      [{ lookups: { main: { caps: { upMm: "wide", downMm: 0.5 } } } }, "lookups.main.caps.upMm"],
      [{ exceptions: [{ chartId, rule: "law" }] }, "exceptions.0.reason"],
      [{ exceptions: [{ chartId, rule: "law", reason: "" }] }, "exceptions.0.reason"],
      [{ exceptions: [{ chartId: foreignChart, rule: "law", reason: "Not ours" }] }, "exceptions.0.chartId"],
      [{ managersMayApprove: true, revision: 7 }, "revision"],
    ];
    for (const [body, field] of bad) {
      const err = await refusal(rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, body));
      expect(err.status, JSON.stringify(body)).toBe(field === "revision" ? 409 : 400);
      expect(JSON.stringify(err.issues), JSON.stringify(body)).toContain(
        field.includes(".")
          ? JSON.stringify(field.split(".").map((p) => (/^\d+$/.test(p) ? Number(p) : p))).slice(1, -1)
          : field,
      );
    }
    expect(await footprint()).toEqual(after);
    expect(after.rules).toEqual(before.rules);
  });

  it("a chart outside the rules cannot be approved and the refusal names the rule; an exception with a reason is printed and lets it through", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("Murray POT"),
    );
    const { revision } = await rulesOps.getLabRules(as(team.people.lead), { lab: team.lab.slug });
    const res = await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      { revision, lookups: { proximal: { laws: ["finet", "huo-kassab"], caps: { upMm: 0.25, downMm: 0.5 } } } },
    );
    expect(res.revision).toBe(revision + 1);
    expect(res.changed).toEqual(["lookups"]);
    const [audit] = (await rulesAudit()).slice(-1);
    expect(audit).toMatchObject({ actorUserId: team.people.lead.id, detail: { revision: revision + 1 } });
    expect(
      (audit!.detail as { after: { lookups: { proximal: { laws: string[] } } } }).after.lookups.proximal.laws,
    ).toEqual(["finet", "huo-kassab"]);

    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const err = await refusal(ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true }));
    expect(err.status).toBe(422);
    expect(err.message).toMatch(/laws allowed/);
    expect(err.message).toMatch(/not Murray/);
    expect(err.issues).toEqual([expect.objectContaining({ path: ["law"] })]);
    expect((await getEdition({ labId: team.lab.id, editionId: ed.id }))!.status).toBe("draft");

    // The lead records an exception for this chart alone; an older revision is refused.
    const stale = await refusal(
      rulesOps.setLabRules(
        as(team.people.lead),
        { lab: team.lab.slug },
        {
          revision,
          exceptions: [{ chartId, rule: "law", reason: "Murray agreed for the teaching room" }],
        },
      ),
    );
    expect(stale.status).toBe(409);
    const withException = await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      {
        revision: revision + 1,
        exceptions: [
          { chartId, rule: "law", reason: "Murray agreed for the teaching room" },
          { chartId, rule: "legibility", reason: "Hangs beside the table" },
        ],
      },
    );
    expect(withException.changed).toEqual(["exceptions"]);
    // Four eyes: the lead who recorded the exceptions no longer approves this chart's editions.
    const ownException = await refusal(
      ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true }),
    );
    expect(ownException.status).toBe(403);
    expect(ownException.message).toMatch(/exceptions for this chart \(law: Murray agreed for the teaching room/);
    await rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, { managersMayApprove: true });
    // The draft made before the exception no longer matches what the poster would print.
    expect(
      (await refusal(ops.approveEdition(as(team.people.manager), { editionId: ed.id }, { reviewed: true }))).status,
    ).toBe(409);
    const next = await ops.createEdition(as(team.people.educator), { chartId });
    const ok = await ops.approveEdition(as(team.people.manager), { editionId: next.id }, { reviewed: true });
    expect(ok.status).toBe("approved");
    const [row] = await db.select().from(editions).where(eq(editions.id, next.id));
    expect((row!.snapshot as { ruleExceptions?: unknown }).ruleExceptions).toEqual([
      expect.objectContaining({
        rule: "law",
        reason: "Murray agreed for the teaching room",
        relaxes: "Murray for a POT (proximal) lookup; the lab allows Finet, Huo-Kassab",
        recordedBy: team.people.lead.name,
        recordedOn: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/),
      }),
      expect.objectContaining({ rule: "legibility", reason: "Hangs beside the table" }),
    ]);
  });

  it("an exception to the legibility rule excuses the distance, not figures too small to read even at arm's length", async () => {
    // A 3 x 3 grid on A4 portrait read from 2.5 m: the headings sized for that distance leave the
    // grid almost no room (tests/unit/poster/gate.test.ts measures the figures).
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      chartDefinitionSchema.parse({
        title: "Three by three on A4",
        law: { law: "finet", ratio: 0.678 },
        lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [2.5, 2.75, 3], cols: [2, 2.25, 2.5] }],
        stentPlatformId: stentId,
        paper: "A4",
        orientation: "portrait",
        readingDistanceM: 2.5,
      }),
    );
    const current = await rulesOps.getLabRules(as(team.people.lead), { lab: team.lab.slug });
    await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      {
        revision: current.revision,
        exceptions: [...current.exceptions, { chartId, rule: "legibility", reason: "Read at the table only" }],
      },
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const err = await refusal(ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true }));
    expect(err.status).toBe(409);
    expect(err.message).toMatch(
      /^Lab rule "legibility": the exception recorded for this chart excuses the reading distance/,
    );
    expect(err.message).toMatch(/cannot be read even from 0\.4 m/);
    expect(err.issues).toEqual([expect.objectContaining({ message: "legibility" })]);
    expect((await getEdition({ labId: team.lab.id, editionId: ed.id }))!.status).toBe("draft");
  });

  it("charts without exceptions freeze no ruleExceptions field; caps above the lab's are refused by name, at creation and at approval", async () => {
    const wide = {
      ...definition("Wide caps", { law: "finet", ratio: 0.678 }),
      roundingCaps: { upMm: 0.5, downMm: 0.5 },
    };
    const created = await refusal(chartOps.createChart(as(team.people.educator), { lab: team.lab.slug }, wide));
    expect(created.status).toBe(400);
    expect(created.issues).toEqual([expect.objectContaining({ path: ["roundingCaps", "upMm"] })]);
    // Within the rules when created; the lead then lowers the lab's cap, and approval refuses.
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      {
        ...wide,
        roundingCaps: { upMm: 0.2, downMm: 0.5 },
      },
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const [row] = await db.select().from(editions).where(eq(editions.id, ed.id));
    expect(row!.snapshot).not.toHaveProperty("ruleExceptions");
    await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      {
        lookups: { proximal: { caps: { upMm: 0.1, downMm: 0.5 } } },
      },
    );
    const err = await refusal(ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true }));
    expect(err.status).toBe(409);
    const next = await ops.createEdition(as(team.people.educator), { chartId });
    const refused = await refusal(ops.approveEdition(as(team.people.lead), { editionId: next.id }, { reviewed: true }));
    expect(refused.status).toBe(422);
    expect(refused.message).toMatch(/rounding caps/);
    expect(refused.issues).toEqual([expect.objectContaining({ path: ["roundingCaps", "upMm"] })]);
  });

  it("only the lead changes them; others are refused and nothing changes", async () => {
    const before = await footprint();
    for (const role of ["manager", "educator", "operator"] as const)
      expect(
        (await refusal(rulesOps.setLabRules(as(team.people[role]), { lab: team.lab.slug }, { exceptions: [] }))).status,
      ).toBe(403);
    expect(
      (await refusal(rulesOps.setLabRules(as(other.people.lead), { lab: team.lab.slug }, { exceptions: [] }))).status,
    ).toBe(404);
    expect(await footprint()).toEqual(before);
  });
});
