import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { listAuditEvents, recordAudit } from "@/db/queries/audit";
import { readAccount } from "@/lib/ops/account-settings";
import { addMember, createUser, labWithTeam, sessionUser } from "./support/fixtures";

afterAll(() => pool.end());

describe("a lab's audit log", () => {
  let team: Awaited<ReturnType<typeof labWithTeam>>;
  beforeAll(async () => {
    team = await labWithTeam();
    const outsiderOnly = await createUser("not-a-member");
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

  it("lists only the lab's own events, newest first: no member's account events, nothing from elsewhere", async () => {
    const page = await listAuditEvents({ labId: team.lab.id, limit: 50 });
    const actions = page.events.map((e) => e.action);
    expect(actions).toEqual(Array(7).fill("test.step"));
    expect(page.events.every((e) => e.labId === team.lab.id)).toBe(true);
    const ids = page.events.map((e) => e.id);
    expect([...ids].sort((a, b) => b - a)).toEqual(ids);
    expect(page.events.find((e) => e.action === "test.step")?.actorEmail).toBe(team.people.manager.email);
  });

  it("pages by id both ways without gaps or overlaps", async () => {
    const all = (await listAuditEvents({ labId: team.lab.id, limit: 200 })).events.map((e) => e.id);
    const first = await listAuditEvents({ labId: team.lab.id, limit: 4 });
    expect(first.newerAfter).toBeUndefined();
    const second = await listAuditEvents({ labId: team.lab.id, before: first.olderBefore, limit: 4 });
    expect(second.olderBefore).toBeUndefined();
    expect([...first.events, ...second.events].map((e) => e.id)).toEqual(all);
    expect(second.newerAfter).toBe(second.events[0]!.id);
    const back = await listAuditEvents({ labId: team.lab.id, after: second.newerAfter, limit: 4 });
    expect(back.events.map((e) => e.id)).toEqual(first.events.map((e) => e.id));
    expect(back.newerAfter).toBeUndefined();
  });
});

describe("account events", () => {
  it("a person who joins another lab brings no account history into its log; it stays on their account page", async () => {
    const a = await labWithTeam();
    const lead = a.people.lead;
    const signIns = Array.from({ length: 3 }, (_, i) => ({ ip: `192.0.2.${i + 1}` }));
    for (const detail of signIns)
      await recordAudit({
        labId: null,
        actorUserId: lead.id,
        action: "signin.succeeded",
        targetType: "user",
        targetId: lead.id,
        detail,
      });
    await recordAudit({
      labId: null,
      actorUserId: null,
      action: "signin.failed",
      targetType: "user",
      targetId: lead.id,
      detail: { email: lead.email, ip: "198.51.100.7" },
    });
    await recordAudit({
      labId: null,
      actorUserId: a.people.operator.id,
      action: "signin.succeeded",
      targetType: "user",
      targetId: a.people.operator.id,
    });
    // The lead joins the other lab, whose manager reads its log.
    await addMember(a.other.id, lead.id, "educator");
    await recordAudit({ labId: a.other.id, actorUserId: lead.id, action: "invitation.accepted" });
    const otherLog = await listAuditEvents({ labId: a.other.id, limit: 200 });
    expect(otherLog.events.map((e) => e.action)).toEqual(["invitation.accepted"]);
    const ownLog = await listAuditEvents({ labId: a.lab.id, limit: 200 });
    expect(ownLog.events.filter((e) => /^(signin|signout|password_reset|account)\b/.test(e.action))).toEqual([]);

    const account = await readAccount({ kind: "user", user: await sessionUser(lead.id) });
    expect(account.activity.map((e) => [e.what, e.from])).toEqual([
      ["Failed sign-in", "198.51.100.7"],
      ["Signed in", "192.0.2.3"],
      ["Signed in", "192.0.2.2"],
      ["Signed in", "192.0.2.1"],
    ]);
  });
});
