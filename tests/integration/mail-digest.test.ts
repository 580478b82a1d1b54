// Mail that helps, over SMTP to the local fake: stale copies are reported as one digest per lab
// after a quiet period (sent once, however many deliverers race for it), an all-clear follows
// when every copy is current again (or the last stale one is taken down), a change undone
// within the quiet period mails nothing, and sign-off mails reach the approvers and the author.
import { and, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, balloons, postings, rooms, staleNotices } from "@/db/schema";
import { env } from "@/lib/env";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import { deliverDigest, deliverDueDigests } from "@/lib/ops/notices";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { mailTo } from "../support/mail";
import { createRoom, recordPosting, takeDownPosting, updateBalloon } from "./support/writes";
import { as } from "../support/roles";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
// What the timer does once the lab has been quiet, without waiting the quiet period out.
const afterQuiet = () => deliverDigest({ labId: team.lab.id, quietSeconds: 0 });
const families: { id: number; title: string; room: string; balloon375: number }[] = [];

beforeAll(async () => {
  team = await labWithTeam();
  // Three charts, each on its own family, each hanging in its own room.
  for (const n of [1, 2, 3]) {
    stentId = await stentPlatformFor(team.lab.id);
    const [fam] = await db
      .insert(balloonFamilies)
      .values({
        labId: team.lab.id,
        name: `NC digest ${n}`,
        compliance: "nc",
        nominalAtm: 10,
        rbpAtm: 18,
        growthAtRbpMm: 0,
      })
      .$returningId();
    await db
      .insert(balloons)
      .values(
        Array.from({ length: 13 }, (_, i) => ({ labId: team.lab.id, familyId: fam!.id, diameterMm: 2 + i * 0.25 })),
      );
    const title = `Digest chart ${n}`;
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      chartDefinitionSchema.parse({
        title,
        law: { law: "finet", ratio: 0.678 },
        lookups: [
          {
            kind: "proximal",
            familyId: fam!.id,
            rounding: "up",
            rows: { from: 2.5, to: 3.5, step: 0.25 },
            cols: { from: 2, to: 3, step: 0.25 },
          },
        ],
        stentPlatformId: stentId,
        paper: "A4",
        orientation: "portrait",
        readingDistanceM: 1,
      }),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true });
    const room = `Procedure room ${n}`;
    const { id: roomId } = await createRoom({ labId: team.lab.id, name: room, actor: team.people.manager });
    await recordPosting({ labId: team.lab.id, editionId: ed.id, roomId, actor: team.people.operator });
    const [b] = await db
      .select({ id: balloons.id })
      .from(balloons)
      .where(and(eq(balloons.familyId, fam!.id), eq(balloons.diameterMm, 3.75)));
    families.push({ id: fam!.id, title, room, balloon375: b!.id });
  }
});

afterAll(() => pool.end());

const setStock = (i: number, inStock: boolean) =>
  updateBalloon({
    labId: team.lab.id,
    actorUserId: team.people.manager.id,
    balloonId: families[i]!.balloon375,
    patch: { inStock },
  });

describe("stale-copy digest", () => {
  it("runs with a quiet period under test", () => expect(env.STALE_MAIL_QUIET_SECONDS).toBeGreaterThanOrEqual(1));

  it("three quick changes: nothing during the quiet period, then ONE digest naming every room and copy, sent once by racing deliverers", async () => {
    const before = (await mailTo(team.people.manager.email)).length;
    for (const i of [0, 1, 2]) await setStock(i, false);
    const pending = await db.select().from(staleNotices).where(eq(staleNotices.labId, team.lab.id));
    expect(pending.filter((n) => n.sentAt === null)).toHaveLength(3);
    // Writes and ticks inside the quiet period send nothing.
    expect(await deliverDigest({ labId: team.lab.id })).toBeNull();
    expect(await mailTo(team.people.manager.email)).toHaveLength(before);

    // Two instances' timers and a write's delivery race for the same digest.
    const outcomes = await Promise.all([afterQuiet(), afterQuiet(), deliverDueDigests({ quietSeconds: 0 })]);
    expect(outcomes.filter((o) => o === "digest")).toHaveLength(1);
    const mails = await mailTo(team.people.manager.email);
    expect(mails).toHaveLength(before + 1);
    const digest = mails.at(-1)!;
    expect(digest.subject).toBe(`Forkwall: 3 wall printouts to replace in "${team.lab.name}"`);
    expect(digest.text).toContain("Rooms to visit: Procedure room 1, Procedure room 2, Procedure room 3");
    for (const f of families) expect(digest.text).toContain(`"${f.title}", edition 1, is outdated`);
    expect(digest.text).toContain("3.75 mm NC balloon no longer stocked");
    expect(digest.envelopeTo).toEqual([team.people.manager.email]);
    expect(await mailTo(team.people.operator.email)).toEqual([]);
    const rows = await db.select().from(staleNotices).where(eq(staleNotices.labId, team.lab.id));
    expect(rows.every((r) => r.sentAt !== null)).toBe(true);
    // Nothing more after another quiet period.
    expect(await afterQuiet()).toBeNull();
    expect(await mailTo(team.people.manager.email)).toHaveLength(before + 1);
  });

  it("restoring every copy sends one all-clear after the quiet period", async () => {
    const before = (await mailTo(team.people.manager.email)).length;
    await setStock(0, true);
    await setStock(1, true);
    // Copy 3 is still stale: the digest says so (no all-clear yet) only if a notice is waiting; none is.
    expect(await afterQuiet()).toBeNull();
    await setStock(2, true);
    expect(await deliverDigest({ labId: team.lab.id })).toBeNull();
    expect(await afterQuiet()).toBe("all-clear");
    const mails = await mailTo(team.people.manager.email);
    expect(mails).toHaveLength(before + 1);
    expect(mails.at(-1)!.subject).toBe(`Forkwall: every wall printout in "${team.lab.name}" is current again`);
    expect(mails.at(-1)!.text).toContain("nothing needs replacing");
  });

  it("a change undone within the quiet period mails nothing", async () => {
    const before = (await mailTo(team.people.manager.email)).length;
    await setStock(1, false);
    await setStock(1, true);
    expect(await afterQuiet()).toBe("quiet");
    expect(await mailTo(team.people.manager.email)).toHaveLength(before);
  });
});

describe("a stale copy taken down", () => {
  it("when it was the last stale copy, an all-clear follows that names what came down", async () => {
    const before = (await mailTo(team.people.manager.email)).length;
    await setStock(0, false);
    expect(await afterQuiet()).toBe("digest");
    const [hanging] = await db
      .select({ id: postings.id })
      .from(postings)
      .innerJoin(rooms, eq(rooms.id, postings.roomId))
      .where(and(eq(rooms.labId, team.lab.id), eq(rooms.name, families[0]!.room), isNull(postings.removedAt)));
    await takeDownPosting({ labId: team.lab.id, postingId: hanging!.id, actor: team.people.operator });
    expect(await afterQuiet()).toBe("all-clear");
    const mails = await mailTo(team.people.manager.email);
    expect(mails).toHaveLength(before + 2);
    expect(mails.at(-1)!.subject).toBe(`Forkwall: every wall printout in "${team.lab.name}" is current again`);
    expect(mails.at(-1)!.text).toContain(`was taken down in ${families[0]!.room}`);
    // The stock comes back with nothing hanging in that room: no mail.
    await setStock(0, true);
    expect(await afterQuiet()).toBeNull();
    expect(await mailTo(team.people.manager.email)).toHaveLength(before + 2);
  });
});

describe("sign-off mail", () => {
  it("a submitted draft mails the approvers (not its author); approval and return mail the author", async () => {
    const f = families[0]!;
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      chartDefinitionSchema.parse({
        title: "Sign-off mail chart",
        law: { law: "murray" },
        lookups: [{ kind: "proximal", familyId: f.id, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
        stentPlatformId: stentId,
        paper: "A4",
        orientation: "portrait",
        readingDistanceM: 1,
      }),
    );
    const lead = team.people.lead.email;
    const educator = team.people.educator.email;
    const leadBefore = (await mailTo(lead)).length;
    const eduBefore = (await mailTo(educator)).length;
    const managerBefore = (await mailTo(team.people.manager.email)).length;

    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const waiting = (await mailTo(lead)).slice(leadBefore);
    expect(waiting).toHaveLength(1);
    expect(waiting[0]!.subject).toBe(
      `Forkwall: Edition ${ed.number} of "Sign-off mail chart" is waiting for sign-off in "${team.lab.name}"`,
    );
    // The approver lands on the approval screen of this edition, not the designer.
    expect(waiting[0]!.text).toContain(`/labs/${team.lab.slug}/sign-off/${ed.id}\n`);
    expect(waiting[0]!.text).toContain(team.people.educator.name);
    // The author is not told about their own submission; managers are not approvers by default.
    expect(await mailTo(educator)).toHaveLength(eduBefore);
    expect(await mailTo(team.people.manager.email)).toHaveLength(managerBefore);
    // Pressing "Create edition" again answers the same draft and mails nobody.
    await ops.createEdition(as(team.people.educator), { chartId });
    expect(await mailTo(lead)).toHaveLength(leadBefore + 1);

    await ops.rejectEdition(as(team.people.lead), { editionId: ed.id }, { reason: "Rows stop too early" });
    const returned = (await mailTo(educator)).slice(eduBefore);
    expect(returned).toHaveLength(1);
    expect(returned[0]!.subject).toBe(`Forkwall: Edition ${ed.number} of "Sign-off mail chart" was returned`);
    expect(returned[0]!.text).toContain("Reason: Rows stop too early");
    expect(returned[0]!.text).toContain(team.people.lead.name);

    await chartOps.saveChart(
      as(team.people.educator),
      { chartId },
      chartDefinitionSchema.parse({
        title: "Sign-off mail chart",
        law: { law: "murray" },
        lookups: [{ kind: "proximal", familyId: f.id, rounding: "up", rows: [3, 3.5, 4], cols: [2.5, 3] }],
        stentPlatformId: stentId,
        paper: "A4",
        orientation: "portrait",
        readingDistanceM: 1,
      }),
    );
    const next = await ops.createEdition(as(team.people.educator), { chartId });
    expect(await mailTo(lead)).toHaveLength(leadBefore + 2);
    const ok = await ops.approveEdition(as(team.people.lead), { editionId: next.id }, { reviewed: true });
    const approved = (await mailTo(educator)).slice(eduBefore + 1);
    expect(approved).toHaveLength(1);
    expect(approved[0]!.subject).toBe(`Forkwall: Edition ${next.number} of "Sign-off mail chart" was approved`);
    expect(approved[0]!.text).toContain(`due for review by ${ok.reviewBy.slice(0, 10)}`);
    expect(approved[0]!.text).toContain(`/labs/${team.lab.slug}/sign-off/${next.id}\n`);
  });
});
