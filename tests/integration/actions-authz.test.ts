// Walks the server-action rows of the authorization matrix: every actor the row does not allow
// calls the action with input that would work for a manager, and nothing may change.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, invitations, memberships, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session";
import { newToken } from "@/lib/auth/tokens";
import { ACTIONS, type Actor } from "../authz/matrix";
import { labWithTeam, mailTo, unique } from "./support/fixtures";

// The session is the one thing stood in for: who is calling. Everything else is real.
const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));

type ActionFn = (prev: object, form: FormData) => Promise<{ ok?: boolean; message?: string }>;
type Team = Awaited<ReturnType<typeof labWithTeam>>;

let team: Team;
let invitationId: number;
let inviteeEmail: string;

beforeAll(async () => {
  team = await labWithTeam();
  inviteeEmail = `${unique("pending")}@example.test`;
  const [row] = await db
    .insert(invitations)
    .values({ labId: team.lab.id, email: inviteeEmail, role: "operator", tokenHash: newToken().hash, invitedBy: team.people.manager.id, expiresAt: new Date(Date.now() + 3600_000), lastSentAt: new Date() })
    .$returningId();
  invitationId = row!.id;
});
afterAll(() => pool.end());
beforeEach(() => {
  session.user = null;
});

const form = (fields: Record<string, string | number>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, String(v));
  return f;
};

/** Input each guarded action would accept from a manager of the fixture lab. */
const INPUTS: Record<string, (t: Team) => FormData> = {
  inviteMemberAction: (t) => form({ slug: t.lab.slug, email: `${unique("new")}@example.test`, role: "educator" }),
  resendInvitationAction: (t) => form({ slug: t.lab.slug, invitationId }),
  revokeInvitationAction: (t) => form({ slug: t.lab.slug, invitationId }),
  changeMemberRoleAction: (t) => form({ slug: t.lab.slug, membershipId: t.people.educator.membershipId, role: "operator" }),
  removeMemberAction: (t) => form({ slug: t.lab.slug, membershipId: t.people.operator.membershipId }),
  joinLabAction: () => form({ token: newToken().token }),
};

async function snapshot(labId: number) {
  const [m, i, a, u] = await Promise.all([
    db.select().from(memberships).where(eq(memberships.labId, labId)),
    db.select().from(invitations).where(eq(invitations.labId, labId)),
    db.select({ id: auditEvents.id }).from(auditEvents).where(eq(auditEvents.labId, labId)),
    db.select({ id: users.id }).from(users),
  ]);
  return { memberships: m, invitations: i, audit: a.length, users: u.length, mail: (await mailTo(inviteeEmail)).length };
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
        session.user = actor === "anonymous" ? null : (({ id, email, name }) => ({ id, email, name }))(team.people[actor]);
        const before = await snapshot(team.lab.id);
        const result = await mod[row.name]!({}, INPUTS[row.name]!(team));
        expect(result.ok).not.toBe(true);
        const expected = actor === "anonymous" ? /Sign in/ : actor === "outsider" ? /not found/ : /does not allow|not valid|is for/;
        expect(result.message).toMatch(expected);
        expect(await snapshot(team.lab.id)).toEqual(before);
      });
    }
  }

  it("the same input does change things for a manager (so the checks above can fail)", async () => {
    const mod = (await MODULES["app/(lab)/labs/[slug]/members/actions.ts"]!()) as Record<string, ActionFn>;
    session.user = (({ id, email, name }) => ({ id, email, name }))(team.people.manager);
    const before = await snapshot(team.lab.id);
    const result = await mod.changeMemberRoleAction!({}, INPUTS.changeMemberRoleAction!(team));
    expect(result).toMatchObject({ ok: true });
    const after = await snapshot(team.lab.id);
    expect(after).not.toEqual(before);
    const [m] = await db.select().from(memberships).where(and(eq(memberships.labId, team.lab.id), eq(memberships.id, team.people.educator.membershipId)));
    expect(m?.role).toBe("operator");
  });
});
