// The first-run path of a new lab: the size ladder (no pressure is ever made up) and the steps
// ticking as the lab fills, on the real MariaDB.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, balloons, labs } from "@/db/schema";
import { SIZE_LADDER } from "@/lib/labs/first-run";
import { createLadderFamily, firstRun } from "@/lib/ops/first-run";
import { inviteMember } from "@/lib/ops/members";
import { templateDefinition } from "@/lib/charts/templates";
import { createChart } from "@/lib/ops/charts";
import { createLab } from "@/lib/ops/lab-create";
import { getStock } from "@/lib/ops/stock";
import { addMember, createUser, labWithTeam, unique, stentPlatformFor } from "./support/fixtures";
import { as } from "../support/roles";
import { refusal } from "../support/refusal";

afterAll(() => pool.end());

type Team = Awaited<ReturnType<typeof labWithTeam>>;
let team: Team;

beforeAll(async () => {
  team = await labWithTeam();
});

const stockState = async (labId: number) => ({
  revision: (await db.select({ r: labs.stockRevision }).from(labs).where(eq(labs.id, labId)))[0]!.r,
  families: await db.select().from(balloonFamilies).where(eq(balloonFamilies.labId, labId)),
  balloons: await db.select().from(balloons).where(eq(balloons.labId, labId)),
});

describe("the generic size ladder", () => {
  it("refuses a family without pressures (400 naming them) and changes nothing", async () => {
    const before = await stockState(team.lab.id);
    const err = await refusal(
      createLadderFamily(
        as(team.people.manager),
        { lab: team.lab.slug },
        { name: "NC ladder", compliance: "nc", diameters: [...SIZE_LADDER] },
      ),
    );
    expect(err.status).toBe(400);
    expect(err.issues!.map((i) => i.path[0])).toEqual(expect.arrayContaining(["nominalAtm", "rbpAtm"]));
    expect(await stockState(team.lab.id)).toEqual(before);
  });

  it("only managers may use it", async () => {
    for (const role of ["lead", "educator", "operator"] as const) {
      const err = await refusal(
        createLadderFamily(
          as(team.people[role]),
          { lab: team.lab.slug },
          { name: "NC ladder", compliance: "nc", nominalAtm: 12, rbpAtm: 20, diameters: [2] },
        ),
      );
      expect(err.status).toBe(403);
    }
  });

  it("adds the ticked diameters with the typed pressures as one stock change; the stock step ticks", async () => {
    const before = await stockState(team.lab.id);
    let steps = await firstRun(as(team.people.manager), { lab: team.lab.slug });
    expect(steps.find((s) => s.key === "stock")!.done).toBe(false);

    const ticked = SIZE_LADDER.filter((d) => d >= 2 && d <= 4);
    const res = await createLadderFamily(
      as(team.people.manager),
      { lab: team.lab.slug },
      { name: "NC ladder (illustrative)", compliance: "nc", nominalAtm: 12, rbpAtm: 20, diameters: ticked },
    );
    expect(res.applied).toBe(true);
    const after = await stockState(team.lab.id);
    expect(after.revision).toBe(before.revision + 1);
    const [family] = after.families;
    expect(family).toMatchObject({ name: "NC ladder (illustrative)", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: null });
    expect(after.balloons.map((b) => b.diameterMm).sort((a, b) => a - b)).toEqual(ticked);
    expect(after.balloons.every((b) => b.inStock && b.familyId === family!.id)).toBe(true);
    const audit = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, team.lab.id), eq(auditEvents.action, "stock.import")));
    expect(audit.length).toBeGreaterThanOrEqual(1);

    steps = await firstRun(as(team.people.manager), { lab: team.lab.slug });
    expect(steps.find((s) => s.key === "stock")).toMatchObject({
      done: true,
      state: `${ticked.length} balloon sizes in stock in 1 family.`,
    });

    // The same name again: 409 naming the field, nothing added.
    const again = await refusal(
      createLadderFamily(
        as(team.people.manager),
        { lab: team.lab.slug },
        { name: "nc ladder (illustrative)", compliance: "nc", nominalAtm: 12, rbpAtm: 20, diameters: [5] },
      ),
    );
    expect(again.status).toBe(409);
    expect(again.issues?.[0]?.path).toEqual(["name"]);
    expect(await stockState(team.lab.id)).toEqual(after);
  });
});

describe("chart templates on ladder stock", () => {
  it("both templates make charts the lab's rules accept, with axes inside the stocked range", async () => {
    // A POT chart needs a stent platform to check against (lab rule), so the lab stocks one first.
    await stentPlatformFor(team.lab.id);
    const stock = await getStock(as(team.people.manager), { lab: team.lab.slug });
    const [family] = stock.balloonFamilies;
    const stocked = family!.balloons.filter((b) => b.inStock).map((b) => b.diameterMm);
    for (const template of ["pot", "kissing"] as const) {
      const definition = templateDefinition(template, stock);
      expect(definition.lookups.map((l) => l.kind)).toEqual(template === "pot" ? ["proximal"] : ["side", "main"]);
      for (const l of definition.lookups) {
        expect(l.familyId).toBe(family!.id);
        for (const axis of [l.rows, l.cols]) {
          const { from, to } = axis as { from: number; to: number };
          expect(from).toBeGreaterThanOrEqual(Math.min(...stocked));
          expect(to).toBeLessThanOrEqual(Math.max(...stocked));
        }
      }
      const chart = await createChart(as(team.people.educator), { lab: team.lab.slug }, definition);
      expect(chart.title).toBe(definition.title);
    }
    const steps = await firstRun(as(team.people.manager), { lab: team.lab.slug });
    expect(steps.find((s) => s.key === "chart")).toMatchObject({ done: true, state: "2 charts designed." });
  });

  it("a balloon family cannot exist without its pressures (the database refuses it)", async () => {
    await expect(
      db.insert(balloonFamilies).values({
        labId: team.lab.id,
        name: "No pressures",
        compliance: "nc",
        nominalAtm: null as unknown as number,
        rbpAtm: null as unknown as number,
      }),
    ).rejects.toThrow();
  });
});

describe("first-run steps", () => {
  it("an invited lead is not a member yet; an accepted one ticks the step", async () => {
    // A lab with only its manager (labWithTeam has a lead and an educator already).
    const manager = await createUser("fr-manager");
    const slug = unique("fr");
    await createLab(as(manager), { name: "First-run lab (illustrative)", slug });
    const steps = () => firstRun(as(manager), { lab: slug });
    expect((await steps()).every((s) => !s.done)).toBe(true);
    await inviteMember(as(manager), { lab: slug }, { email: `lead-${slug}@example.test`, role: "lead" });
    const invited = (await steps()).find((s) => s.key === "lead")!;
    expect(invited.done).toBe(false);
    expect(invited.state).toMatch(/Invited, waiting/);
    const lead = await createUser("fr-lead");
    const [lab] = await db.select().from(labs).where(eq(labs.slug, slug));
    await addMember(lab!.id, lead.id, "lead");
    expect((await steps()).find((s) => s.key === "lead")!.done).toBe(true);
  });
});
