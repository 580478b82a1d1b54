import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { getCheckByToken } from "@/lib/ops/check";
import { getEdition } from "@/db/queries/editions";
import { roomBoard } from "@/db/queries/rooms";
import { approveEdition, createChart, createEdition, createRoom, recordPosting, updateBalloon } from "./support/writes";
import { balloonFamilies, balloons, labs, memberships, postings, staleNotices, users } from "@/db/schema";
import { env } from "@/lib/env";
import { deliverDigest } from "@/lib/ops/notices";
import { mailTo } from "../support/mail";
import { smallPotChart } from "../support/chart-fixtures";
import { stentPlatformFor } from "./support/fixtures";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

// An invented lab of its own; mail goes over SMTP to the fake that `npm test` runs.
const tag = randomUUID().slice(0, 8);
const emails = {
  manager: `mgr-${tag}@forkwall.test`,
  educator: `edu-${tag}@forkwall.test`,
  lead: `lead-${tag}@forkwall.test`,
  operator: `op-${tag}@forkwall.test`,
};
const ids = { lab: 0, family: 0, chart: 0, edition: 0, room: 0, posting: 0, token: "" };
const people = {
  manager: { id: 0, name: "Test manager" },
  educator: { id: 0, name: "Test educator" },
  lead: { id: 0, name: "Test lead" },
  operator: { id: 0, name: "Test operator" },
};

const balloonId = async (d: number) =>
  (
    await db
      .select({ id: balloons.id })
      .from(balloons)
      .where(and(eq(balloons.familyId, ids.family), eq(balloons.diameterMm, d)))
  )[0]!.id;

beforeAll(async () => {
  const [lab] = await db
    .insert(labs)
    .values({ slug: `st-${tag}`, name: `Stale test lab ${tag}` })
    .$returningId();
  ids.lab = lab!.id;
  for (const role of ["manager", "educator", "lead", "operator"] as const) {
    const [u] = await db
      .insert(users)
      .values({ email: emails[role], name: people[role].name, passwordHash: "x" })
      .$returningId();
    people[role].id = u!.id;
    await db.insert(memberships).values({ labId: ids.lab, userId: u!.id, role, notifyStale: role === "educator" });
  }
  stentId = await stentPlatformFor(ids.lab);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({
      labId: ids.lab,
      name: "NC test family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: null,
    })
    .$returningId();
  ids.family = fam!.id;
  await db.insert(balloons).values(
    Array.from({ length: 13 }, (_, i) => ({
      labId: ids.lab,
      familyId: ids.family,
      diameterMm: 2 + i * 0.25,
      inStock: true,
    })),
  );
  const definition = smallPotChart(ids.family, "POT chart", stentId);
  ids.chart = (await createChart({ labId: ids.lab, userId: people.educator.id, definition })).id;
  const ed = await createEdition({ labId: ids.lab, chartId: ids.chart, actor: people.educator });
  await approveEdition({ labId: ids.lab, editionId: ed.id, actor: people.lead });
  ids.edition = ed.id;
  ids.token = ed.checkToken;
  ids.room = (await createRoom({ labId: ids.lab, name: "Procedure room 1", actor: people.manager })).id;
  ids.posting = (
    await recordPosting({ labId: ids.lab, editionId: ids.edition, roomId: ids.room, actor: people.operator })
  ).id;
});

afterAll(() => pool.end());

// What the timer does once the lab has been quiet, without waiting the quiet period out.
const afterQuietPeriod = () => deliverDigest({ labId: ids.lab, quietSeconds: 0 });

describe("stale copies", () => {
  it("a posted current edition starts current, on the check page and the room board", async () => {
    expect((await getCheckByToken({ token: ids.token }))!.status).toBe("current");
    const [room] = await roomBoard({ labId: ids.lab });
    expect(room!.postings[0]).toMatchObject({ status: "current", editionNumber: 1 });
    expect(await mailTo(emails.manager)).toEqual([]);
  });

  it("marking a size the chart prints out of stock makes it outdated, names the size, and mails once", async () => {
    await updateBalloon({
      labId: ids.lab,
      actorUserId: people.manager.id,
      balloonId: await balloonId(3.75),
      patch: { inStock: false },
    });
    const check = await getCheckByToken({ token: ids.token });
    expect(check!.status).toBe("outdated");
    expect(check!.changes.map((c) => c.detail)).toContain("3.75 mm NC balloon no longer stocked (NC test family)");

    // Nothing before the quiet period; then one digest.
    if (env.STALE_MAIL_QUIET_SECONDS > 0) expect(await mailTo(emails.manager)).toEqual([]);
    expect(await afterQuietPeriod()).toBe("digest");
    const [mail, ...more] = await mailTo(emails.manager);
    expect(more).toEqual([]);
    expect(mail!.subject).toContain("1 wall printout to replace");
    expect(mail!.text).toContain("Procedure room 1");
    expect(mail!.text).toContain("3.75 mm NC balloon no longer stocked");
    // Managers and the educator who opted in; not the lead or operator.
    expect(mail!.envelopeTo.sort()).toEqual([emails.educator, emails.manager].sort());
    expect(await mailTo(emails.operator)).toEqual([]);

    // A further change while the copy is already stale sends nothing new.
    await updateBalloon({
      labId: ids.lab,
      actorUserId: people.manager.id,
      balloonId: await balloonId(3.5),
      patch: { inStock: false },
    });
    expect(await afterQuietPeriod()).toBeNull();
    expect(await mailTo(emails.manager)).toHaveLength(1);
    const notices = await db.select().from(staleNotices).where(eq(staleNotices.labId, ids.lab));
    expect(notices).toHaveLength(1);
    expect(notices[0]!.sentAt).not.toBeNull();
  });

  it("restoring the stock makes it current again; going stale again is a new change and a new e-mail", async () => {
    await updateBalloon({
      labId: ids.lab,
      actorUserId: people.manager.id,
      balloonId: await balloonId(3.5),
      patch: { inStock: true },
    });
    await updateBalloon({
      labId: ids.lab,
      actorUserId: people.manager.id,
      balloonId: await balloonId(3.75),
      patch: { inStock: true },
    });
    expect((await getCheckByToken({ token: ids.token }))!.status).toBe("current");
    const [p] = await db.select().from(postings).where(eq(postings.id, ids.posting));
    expect(p!.lastStatus).toBe("current");

    // A size outside what the chart can print changes nothing on the wall.
    await updateBalloon({
      labId: ids.lab,
      actorUserId: people.manager.id,
      balloonId: await balloonId(5),
      patch: { inStock: false },
    });
    expect((await getCheckByToken({ token: ids.token }))!.status).toBe("current");
    // Every copy is current again: one all-clear after the quiet period.
    expect(await afterQuietPeriod()).toBe("all-clear");
    const cleared = await mailTo(emails.manager);
    expect(cleared).toHaveLength(2);
    expect(cleared[1]!.subject).toContain("current again");

    // A newer approved edition supersedes the posted one: one more e-mail, pointing at it.
    const next = await createEdition({ labId: ids.lab, chartId: ids.chart, actor: people.educator });
    await approveEdition({ labId: ids.lab, editionId: next.id, actor: people.manager });
    const check = await getCheckByToken({ token: ids.token });
    expect(check).toMatchObject({ status: "superseded", currentEdition: { number: 2 } });
    expect(await afterQuietPeriod()).toBe("digest");
    const mails = await mailTo(emails.manager);
    expect(mails).toHaveLength(3);
    expect(mails[2]!.text).toContain(`/api/v1/editions/${next.id}/pdf`);
    expect((await getEdition({ labId: ids.lab, editionId: ids.edition }))!.status).toBe("superseded");
  });
});
