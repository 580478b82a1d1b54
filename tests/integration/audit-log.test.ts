import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { listAuditEvents, recordAudit } from "@/db/queries/audit";
import { createUser, labWithTeam } from "./support/fixtures";

afterAll(() => pool.end());

describe("a lab's audit log", () => {
  let team: Awaited<ReturnType<typeof labWithTeam>>;
  let outsiderOnly: { id: number };
  beforeAll(async () => {
    team = await labWithTeam();
    outsiderOnly = await createUser("not-a-member");
    for (let i = 0; i < 7; i++)
      await recordAudit({
        labId: team.lab.id,
        actorUserId: team.people.manager.id,
        action: "test.step",
        detail: { i },
      });
    await recordAudit({
      labId: null,
      actorUserId: team.people.operator.id,
      action: "signin.succeeded",
      targetType: "user",
      targetId: team.people.operator.id,
    });
    await recordAudit({
      labId: null,
      actorUserId: null,
      action: "signin.failed",
      targetType: "user",
      targetId: team.people.lead.id,
      detail: { email: team.people.lead.email },
    });
    await recordAudit({
      labId: null,
      actorUserId: outsiderOnly.id,
      action: "signin.succeeded",
      targetType: "user",
      targetId: outsiderOnly.id,
    });
    await recordAudit({ labId: team.other.id, actorUserId: team.people.outsider.id, action: "test.elsewhere" });
  });

  it("lists the lab's events and its members' account events, newest first, nothing from elsewhere", async () => {
    const page = await listAuditEvents({ labId: team.lab.id, limit: 50 });
    const actions = page.events.map((e) => e.action);
    expect(actions.slice(0, 2)).toEqual(["signin.failed", "signin.succeeded"]);
    expect(actions.filter((a) => a === "test.step")).toHaveLength(7);
    expect(actions).not.toContain("test.elsewhere");
    expect(page.events.some((e) => e.action === "signin.succeeded" && e.targetId === String(outsiderOnly.id))).toBe(
      false,
    );
    const ids = page.events.map((e) => e.id);
    expect([...ids].sort((a, b) => b - a)).toEqual(ids);
    expect(page.events.find((e) => e.action === "test.step")?.actorEmail).toBe(team.people.manager.email);
  });

  it("pages by id both ways without gaps or overlaps", async () => {
    const all = (await listAuditEvents({ labId: team.lab.id, limit: 200 })).events.map((e) => e.id);
    const first = await listAuditEvents({ labId: team.lab.id, limit: 4 });
    expect(first.newerAfter).toBeUndefined();
    const second = await listAuditEvents({ labId: team.lab.id, before: first.olderBefore, limit: 4 });
    const third = await listAuditEvents({ labId: team.lab.id, before: second.olderBefore, limit: 4 });
    expect([...first.events, ...second.events, ...third.events].map((e) => e.id)).toEqual(all.slice(0, 12));
    expect(second.newerAfter).toBe(second.events[0]!.id);
    const back = await listAuditEvents({ labId: team.lab.id, after: second.newerAfter, limit: 4 });
    expect(back.events.map((e) => e.id)).toEqual(first.events.map((e) => e.id));
    expect(back.newerAfter).toBeUndefined();
  });
});
