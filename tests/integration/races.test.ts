// Concurrent writes through the operations layer end in one row and a 409 that names the field
// (or the existing row, for postings), never a 500 or a repeat, and the database itself refuses
// a second hanging copy of an edition in one room.
import { and, count, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, postings, rooms } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { createRoom, recordPosting } from "@/lib/ops/postings";
import { conflictFor, duplicateKey } from "@/lib/ops/write";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, unique, stentPlatformFor } from "./support/fixtures";
import { approveEdition, createChart, createEdition } from "./support/writes";
import { as } from "../support/roles";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let editionId = 0;

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC race", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: null })
    .$returningId();
  const definition = chartDefinitionSchema.parse({
    title: "Races",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId: fam!.id, rounding: "up", rows: [3, 3.5], cols: [2, 2.5] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
  });
  const { id: chartId } = await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition });
  editionId = (await createEdition({ labId: team.lab.id, chartId, actor: team.people.educator })).id;
  await approveEdition({ labId: team.lab.id, editionId, actor: team.people.lead });
});

afterAll(() => pool.end());

describe("concurrent writes", () => {
  it("four rooms of one name at once: one is created, three get 409 naming the field", async () => {
    const name = unique("Room");
    const results = await Promise.allSettled(
      [1, 2, 3, 4].map(() => createRoom(as(team.people.manager), { lab: team.lab.slug }, { name })),
    );
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    for (const r of results.filter((r) => r.status === "rejected")) {
      const err = (r as PromiseRejectedResult).reason as AppError;
      expect(err).toBeInstanceOf(AppError);
      expect(err.status).toBe(409);
      expect(err.issues?.[0]?.path).toEqual(["name"]);
    }
    const [n] = await db
      .select({ n: count() })
      .from(rooms)
      .where(and(eq(rooms.labId, team.lab.id), eq(rooms.name, name)));
    expect(n!.n).toBe(1);
  });

  it("four postings of one edition in one room at once leave one hanging copy; repeats answer the same posting", async () => {
    const room = await createRoom(as(team.people.manager), { lab: team.lab.slug }, { name: unique("Wall") });
    const results = await Promise.all(
      [1, 2, 3, 4].map(() => recordPosting(as(team.people.operator), { editionId }, { roomId: room.id })),
    );
    expect(results.filter((r) => r.created)).toHaveLength(1);
    expect(new Set(results.map((r) => r.id)).size).toBe(1);
    const [n] = await db
      .select({ n: count() })
      .from(postings)
      .where(and(eq(postings.roomId, room.id), isNull(postings.removedAt)));
    expect(n!.n).toBe(1);
  });

  it("the database itself refuses a second hanging copy of an edition in one room", async () => {
    const room = await createRoom(as(team.people.manager), { lab: team.lab.slug }, { name: unique("Wall") });
    const row = { labId: team.lab.id, editionId, roomId: room.id, postedBy: team.people.operator.id };
    await db.insert(postings).values(row);
    const err = await db
      .insert(postings)
      .values(row)
      .then(
        () => null,
        (e: unknown) => e,
      );
    expect(duplicateKey(err)).toBe("postings_one_hanging_uq");
    expect(conflictFor("postings_one_hanging_uq").issues?.[0]?.path).toEqual(["roomId"]);
    // Once taken down, the same room may hold the edition again.
    await db.update(postings).set({ removedAt: new Date() }).where(eq(postings.roomId, room.id));
    await db.insert(postings).values(row);
  });
});
