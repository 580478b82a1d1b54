// Walks the server-action rows of the authorization matrix: every actor the row does not allow
// calls the action with input that would work for a manager, and nothing may change.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { approveEdition, createChart, createEdition, createRoom, recordPosting } from "./support/writes";
import {
  auditEvents,
  balloonFamilies,
  balloons,
  charts,
  editions,
  invitations,
  memberships,
  postings,
  rooms,
  users,
} from "@/db/schema";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import type { SessionUser } from "@/lib/auth/session";
import { newToken } from "@/lib/auth/tokens";
import { ACTIONS, type Actor } from "../authz/matrix";
import { labWithTeam, mailTo, unique } from "./support/fixtures";

// The session is the one thing stood in for: who is calling. Everything else is real.
const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));

type ActionFn = (...args: unknown[]) => Promise<{ ok?: boolean; message?: string }>;
type Team = Awaited<ReturnType<typeof labWithTeam>>;

let team: Team;
let invitationId: number;
let inviteeEmail: string;
// Chart, editions, room and posting of the fixture lab, for the chart and room actions.
const wall = { familyId: 0, chartId: 0, draftId: 0, approvedId: 0, token: "", roomId: 0, postingId: 0 };

beforeAll(async () => {
  team = await labWithTeam();
  inviteeEmail = `${unique("pending")}@example.test`;
  const [row] = await db
    .insert(invitations)
    .values({
      labId: team.lab.id,
      email: inviteeEmail,
      role: "operator",
      tokenHash: newToken().hash,
      invitedBy: team.people.manager.id,
      expiresAt: new Date(Date.now() + 3600_000),
      lastSentAt: new Date(),
    })
    .$returningId();
  invitationId = row!.id;

  const { manager, lead, educator } = team.people;
  const [fam] = await db
    .insert(balloonFamilies)
    .values({
      labId: team.lab.id,
      name: "NC fixture family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: null,
    })
    .$returningId();
  wall.familyId = fam!.id;
  await db.insert(balloons).values(
    Array.from({ length: 13 }, (_, i) => ({
      labId: team.lab.id,
      familyId: wall.familyId,
      diameterMm: 2 + i * 0.25,
      inStock: true,
    })),
  );
  wall.chartId = (await createChart({ labId: team.lab.id, userId: educator.id, definition: chartDefinition() })).id;
  const approved = await createEdition({ labId: team.lab.id, chartId: wall.chartId, actor: educator });
  await approveEdition({ labId: team.lab.id, editionId: approved.id, actor: lead });
  Object.assign(wall, { approvedId: approved.id, token: approved.checkToken });
  wall.draftId = (await createEdition({ labId: team.lab.id, chartId: wall.chartId, actor: educator })).id;
  wall.roomId = (await createRoom({ labId: team.lab.id, name: "Fixture room", actor: manager })).id;
  wall.postingId = (
    await recordPosting({ labId: team.lab.id, editionId: wall.approvedId, roomId: wall.roomId, actor: manager })
  ).id;
});

function chartDefinition(title = "Fixture POT chart") {
  return chartDefinitionSchema.parse({
    title,
    law: { law: "murray" },
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 3.5, step: 0.25 },
        cols: { from: 2, to: 3, step: 0.25 },
        rounding: "up",
        familyId: wall.familyId,
      },
    ],
    paper: "A3",
    orientation: "landscape",
    readingDistanceM: 1,
  });
}
afterAll(() => pool.end());
beforeEach(() => {
  session.user = null;
});

const form = (fields: Record<string, string | number>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, String(v));
  return f;
};

/** Arguments each guarded action would accept from a member allowed to run it. */
const INPUTS: Record<string, (t: Team) => unknown[]> = {
  inviteMemberAction: (t) => [{}, form({ slug: t.lab.slug, email: `${unique("new")}@example.test`, role: "educator" })],
  resendInvitationAction: (t) => [{}, form({ slug: t.lab.slug, invitationId })],
  revokeInvitationAction: (t) => [{}, form({ slug: t.lab.slug, invitationId })],
  changeMemberRoleAction: (t) => [
    {},
    form({ slug: t.lab.slug, membershipId: t.people.educator.membershipId, role: "operator" }),
  ],
  removeMemberAction: (t) => [{}, form({ slug: t.lab.slug, membershipId: t.people.operator.membershipId })],
  joinLabAction: () => [{}, form({ token: newToken().token })],
  saveChartAction: (t) => [t.lab.slug, wall.chartId, chartDefinition("Renamed fixture chart")],
  createEditionAction: (t) => [t.lab.slug, wall.chartId],
  approveEditionAction: (t) => [t.lab.slug, wall.draftId, true],
  rejectEditionAction: (t) => [t.lab.slug, wall.draftId, "Columns too narrow"],
  withdrawEditionAction: (t) => [t.lab.slug, wall.approvedId, "Wrong family on the wall"],
  createRoomAction: (t) => [t.lab.slug, {}, form({ name: unique("room") })],
  renameRoomAction: (t) => [t.lab.slug, wall.roomId, "Renamed room"],
  archiveRoomAction: (t) => [t.lab.slug, wall.roomId],
  takeDownAction: (t) => [t.lab.slug, wall.postingId],
  recordPostingAction: () => [wall.token, wall.roomId],
  takeDownPostingAction: () => [wall.token, wall.postingId],
  setStaleMailAction: (t) => [t.lab.slug, true],
};

async function snapshot(labId: number) {
  const [m, i, a, u, c, e, r, p] = await Promise.all([
    db.select().from(memberships).where(eq(memberships.labId, labId)),
    db.select().from(invitations).where(eq(invitations.labId, labId)),
    db.select({ id: auditEvents.id }).from(auditEvents).where(eq(auditEvents.labId, labId)),
    db.select({ id: users.id }).from(users),
    db.select().from(charts).where(eq(charts.labId, labId)),
    db.select().from(editions).where(eq(editions.labId, labId)),
    db.select().from(rooms).where(eq(rooms.labId, labId)),
    db.select().from(postings).where(eq(postings.labId, labId)),
  ]);
  return {
    memberships: m,
    invitations: i,
    audit: a.length,
    users: u.length,
    mail: (await mailTo(inviteeEmail)).length,
    charts: c,
    editions: e,
    rooms: r,
    postings: p,
  };
}

const actorsRefused = (allowed: readonly string[]): (Actor | "outsider")[] => {
  const all: Actor[] = ["anonymous", "manager", "lead", "educator", "operator"];
  const refused = all.filter((a) => !allowed.includes(a) && !(allowed.includes("any-signed-in") && a !== "anonymous"));
  // A manager of another lab is refused every lab-scoped action of this one.
  const labScoped = allowed.includes("manager") && !allowed.includes("anonymous") && !allowed.includes("any-signed-in");
  return labScoped ? [...refused, "outsider"] : refused;
};

// Static imports, so the bundler can see them; a new "use server" file must be added here.
const MODULES: Record<string, () => Promise<unknown>> = {
  "lib/auth/actions.ts": () => import("@/lib/auth/actions"),
  "app/(lab)/labs/[slug]/members/actions.ts": () => import("@/app/(lab)/labs/[slug]/members/actions"),
  "app/(lab)/labs/[slug]/charts/actions.ts": () => import("@/app/(lab)/labs/[slug]/charts/actions"),
  "app/(lab)/labs/[slug]/rooms/actions.ts": () => import("@/app/(lab)/labs/[slug]/rooms/actions"),
  "app/(public)/v/[token]/actions.ts": () => import("@/app/(public)/v/[token]/actions"),
  "app/(lab)/labs/[slug]/actions.ts": () => import("@/app/(lab)/labs/[slug]/actions"),
};

const guarded = ACTIONS.filter((row) => actorsRefused(row.allowed).length > 0);

describe("server actions refuse disallowed callers and change nothing", () => {
  it("has input for every guarded action in the matrix", () => {
    expect(guarded.length).toBeGreaterThan(0);
    expect(guarded.filter((r) => !INPUTS[r.name]).map((r) => r.name)).toEqual([]);
    expect(guarded.filter((r) => !MODULES[r.file]).map((r) => r.file)).toEqual([]);
  });

  for (const row of guarded) {
    for (const actor of actorsRefused(row.allowed)) {
      it(`${row.name} as ${actor}`, async () => {
        const mod = (await MODULES[row.file]!()) as Record<string, ActionFn>;
        session.user =
          actor === "anonymous" ? null : (({ id, email, name }) => ({ id, email, name }))(team.people[actor]);
        const before = await snapshot(team.lab.id);
        const result = await mod[row.name]!(...INPUTS[row.name]!(team));
        expect(result.ok).not.toBe(true);
        const expected =
          actor === "anonymous" ? /Sign in/ : actor === "outsider" ? /not found/ : /does not allow|not valid|is for/;
        expect(result.message).toMatch(expected);
        expect(await snapshot(team.lab.id)).toEqual(before);
      });
    }
  }

  it("the same input does change things for a manager (so the checks above can fail)", async () => {
    const mod = (await MODULES["app/(lab)/labs/[slug]/members/actions.ts"]!()) as Record<string, ActionFn>;
    session.user = (({ id, email, name }) => ({ id, email, name }))(team.people.manager);
    const before = await snapshot(team.lab.id);
    const result = await mod.changeMemberRoleAction!(...INPUTS.changeMemberRoleAction!(team));
    expect(result).toMatchObject({ ok: true });
    const after = await snapshot(team.lab.id);
    expect(after).not.toEqual(before);
    const [m] = await db
      .select()
      .from(memberships)
      .where(and(eq(memberships.labId, team.lab.id), eq(memberships.id, team.people.educator.membershipId)));
    expect(m?.role).toBe("operator");
  });

  it("chart, room and posting actions do change things for an allowed member", async () => {
    const call = async (file: string, name: string, as: "manager" | "lead" | "operator") => {
      const mod = (await MODULES[file]!()) as Record<string, ActionFn>;
      session.user = (({ id, email, name }) => ({ id, email, name }))(team.people[as]);
      return mod[name]!(...INPUTS[name]!(team));
    };
    const before = await snapshot(team.lab.id);
    expect(await call("app/(lab)/labs/[slug]/rooms/actions.ts", "createRoomAction", "manager")).toMatchObject({
      ok: true,
    });
    expect(await call("app/(lab)/labs/[slug]/charts/actions.ts", "approveEditionAction", "lead")).toMatchObject({
      ok: true,
    });
    expect(await call("app/(public)/v/[token]/actions.ts", "takeDownPostingAction", "operator")).toMatchObject({
      ok: true,
    });
    const after = await snapshot(team.lab.id);
    expect(after.rooms.length).toBe(before.rooms.length + 1);
    expect(after.editions.find((e) => e.id === wall.draftId)?.status).toBe("approved");
    expect(after.postings.find((p) => p.id === wall.postingId)?.removedAt).not.toBeNull();
  });
});
