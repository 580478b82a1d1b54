// "Taken down" can be undone for a day: the copy hangs again with its status, audited; after a
// day, in an archived room, or from another lab it cannot, and nothing changes.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, postings } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { Caller } from "@/lib/ops/caller";
import { recentlyTakenDown, restorePosting } from "@/lib/ops/postings";
import {
  approveEdition,
  createEdition,
  createRoom,
  labWithSmallChart,
  recordPosting,
  takeDownPosting,
} from "./support/writes";

let s: Awaited<ReturnType<typeof labWithSmallChart>>;
let postingId = 0;
const caller = (who: "manager" | "operator" | "outsider"): Caller => {
  const p = s.team.people[who];
  return { kind: "user", user: { id: p.id, email: p.email, name: p.name } };
};
const row = async () => (await db.select().from(postings).where(eq(postings.id, postingId)))[0]!;
const restored = async () =>
  (
    await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, s.team.lab.id), eq(auditEvents.action, "posting.restored")))
  ).length;

beforeAll(async () => {
  s = await labWithSmallChart({ name: `Restore ${Date.now().toString(36)}` });
  const labId = s.team.lab.id;
  const ed = await createEdition({ labId, chartId: s.chartId, actor: s.team.people.educator });
  await approveEdition({ labId, editionId: ed.id, actor: s.team.people.lead });
  const room = await createRoom({ labId, name: "Room 1", actor: s.team.people.manager });
  postingId = (await recordPosting({ labId, editionId: ed.id, roomId: room.id, actor: s.team.people.operator })).id;
});

afterAll(() => pool.end());

describe("putting back a copy taken down by mistake", () => {
  it("lists it for a day and puts it back hanging, with an audit row", async () => {
    await takeDownPosting({ labId: s.team.lab.id, postingId, actor: s.team.people.operator });
    expect((await row()).removedAt).not.toBeNull();
    const listed = await recentlyTakenDown(caller("operator"), { lab: s.team.lab.slug });
    expect(listed.map((r) => [r.postingId, r.room])).toEqual([[postingId, "Room 1"]]);
    await restorePosting(caller("operator"), { lab: s.team.lab.slug, postingId });
    expect(await row()).toMatchObject({ removedAt: null, removedBy: null, lastStatus: "current" });
    expect(await restored()).toBe(1);
    expect(await recentlyTakenDown(caller("operator"), { lab: s.team.lab.slug })).toEqual([]);
  });

  it("refuses after a day (409) and from another lab (404); nothing changes", async () => {
    await takeDownPosting({ labId: s.team.lab.id, postingId, actor: s.team.people.operator });
    await db
      .update(postings)
      .set({ removedAt: new Date(Date.now() - 25 * 60 * 60 * 1000) })
      .where(eq(postings.id, postingId));
    const before = await row();
    const refusal = (p: Promise<unknown>) =>
      p.then(
        () => null,
        (e: unknown) => (e instanceof AppError ? e.status : e),
      );
    expect(await refusal(restorePosting(caller("manager"), { lab: s.team.lab.slug, postingId }))).toBe(409);
    expect(await refusal(restorePosting(caller("outsider"), { lab: s.team.lab.slug, postingId }))).toBe(404);
    expect(await row()).toEqual(before);
    expect(await recentlyTakenDown(caller("manager"), { lab: s.team.lab.slug })).toEqual([]);
    expect(await restored()).toBe(1);
  });
});
