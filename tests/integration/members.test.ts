import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { listMembers } from "@/db/queries/members";
import { changeMemberRole, removeMember } from "./support/writes";
import { auditEvents, memberships } from "@/db/schema";
import { addMember, createLab, createUser, labWithTeam } from "./support/fixtures";
import { refusal } from "../support/refusal";
import { auditCount } from "../support/audit";

afterAll(() => pool.end());

const roleOf = async (id: number) =>
  (await db.select({ role: memberships.role }).from(memberships).where(eq(memberships.id, id)))[0]?.role;

describe("members: roles and removal", () => {
  let team: Awaited<ReturnType<typeof labWithTeam>>;
  beforeAll(async () => {
    team = await labWithTeam();
  });

  it("the last manager can be neither demoted nor removed, and nothing is recorded", async () => {
    const { lab, people } = team;
    const before = await auditCount(lab.id);
    const demote = await refusal(
      changeMemberRole({
        labId: lab.id,
        membershipId: people.manager.membershipId,
        role: "lead",
        actorUserId: people.manager.id,
      }),
    );
    expect(demote?.status).toBe(409);
    expect(demote?.message).toMatch(/only manager/);
    const remove = await refusal(
      removeMember({ labId: lab.id, membershipId: people.manager.membershipId, actorUserId: people.manager.id }),
    );
    expect(remove?.status).toBe(409);
    expect(await roleOf(people.manager.membershipId)).toBe("manager");
    expect(await auditCount(lab.id)).toBe(before);
  });

  it("a role change is recorded with before and after, in the same transaction", async () => {
    const { lab, people } = team;
    const changed = await changeMemberRole({
      labId: lab.id,
      membershipId: people.educator.membershipId,
      role: "lead",
      actorUserId: people.manager.id,
    });
    expect(changed.changed).toBe(true);
    expect(await roleOf(people.educator.membershipId)).toBe("lead");
    const [event] = await db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.labId, lab.id),
          eq(auditEvents.action, "member.role_changed"),
          eq(auditEvents.targetId, String(people.educator.membershipId)),
        ),
      );
    expect(event?.actorUserId).toBe(people.manager.id);
    expect(event?.detail).toEqual({
      member: people.educator.email,
      before: { role: "educator" },
      after: { role: "lead" },
    });
  });

  it("with a second manager the first may step down; then the second is the last", async () => {
    const { lab, people } = team;
    await changeMemberRole({
      labId: lab.id,
      membershipId: people.lead.membershipId,
      role: "manager",
      actorUserId: people.manager.id,
    });
    await changeMemberRole({
      labId: lab.id,
      membershipId: people.manager.membershipId,
      role: "educator",
      actorUserId: people.manager.id,
    });
    const last = await refusal(
      removeMember({ labId: lab.id, membershipId: people.lead.membershipId, actorUserId: people.lead.id }),
    );
    expect(last?.status).toBe(409);
  });

  it("removal deletes the membership only, and is recorded", async () => {
    const { lab, people } = team;
    const removed = await removeMember({
      labId: lab.id,
      membershipId: people.operator.membershipId,
      actorUserId: people.lead.id,
    });
    expect(removed.email).toBe(people.operator.email);
    expect(await roleOf(people.operator.membershipId)).toBeUndefined();
    const events = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, lab.id), eq(auditEvents.action, "member.removed")));
    expect(events.at(-1)?.detail).toMatchObject({
      member: people.operator.email,
      before: { role: "operator" },
      after: null,
    });
    expect((await listMembers({ labId: lab.id })).map((m) => m.email)).not.toContain(people.operator.email);
  });

  it("a membership of another lab is not found through this lab", async () => {
    const { lab, other, people } = team;
    const err = await refusal(
      changeMemberRole({
        labId: lab.id,
        membershipId: people.outsider.membershipId,
        role: "operator",
        actorUserId: people.lead.id,
      }),
    );
    expect(err?.status).toBe(404);
    expect(await roleOf(people.outsider.membershipId)).toBe("manager");
    expect(other.id).not.toBe(lab.id);
  });

  it("two managers demoting each other at the same moment still leave one manager", async () => {
    const lab = await createLab("it-race");
    const a = await createUser("mgr-a");
    const b = await createUser("mgr-b");
    const ma = await addMember(lab.id, a.id, "manager");
    const mb = await addMember(lab.id, b.id, "manager");
    const results = await Promise.allSettled([
      changeMemberRole({ labId: lab.id, membershipId: mb, role: "operator", actorUserId: a.id }),
      changeMemberRole({ labId: lab.id, membershipId: ma, role: "operator", actorUserId: b.id }),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const roles = [await roleOf(ma), await roleOf(mb)];
    expect(roles.filter((r) => r === "manager")).toHaveLength(1);
  });
});
