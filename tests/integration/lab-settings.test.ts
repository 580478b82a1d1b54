// The lab settings routes as a client calls them: members read, managers change, every bad field
// refused with 400 naming it and nothing changed; each change audited with only what changed.
import { and, desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, labs } from "@/db/schema";
import { env } from "@/lib/env";
import { GET, PATCH } from "@/app/api/v1/labs/[slug]/settings/route";
import { POST as inviteRoute } from "@/app/api/v1/labs/[slug]/invitations/route";
import { formatDateTime } from "@/lib/format/dates";
import { labWithTeam, unique } from "./support/fixtures";
import { mailTo } from "../support/mail";
import { auditCount } from "../support/audit";
import { as } from "../support/roles";
import { send, type Answer } from "../support/routes";

vi.mock("@/lib/auth/session", () => import("../support/session"));

let team: Awaited<ReturnType<typeof labWithTeam>>;

type SettingsAnswer = Answer & { changed: string[]; settings: Record<string, unknown> } & Record<string, unknown>;
const settings = (method: "GET" | "PATCH", body?: unknown, slug = team.lab.slug) =>
  send<SettingsAnswer>(
    method === "GET" ? GET : PATCH,
    { slug },
    { method, body, path: `/api/v1/labs/${slug}/settings` },
  );

const labRow = async () => (await db.select().from(labs).where(eq(labs.id, team.lab.id)))[0]!;

beforeAll(async () => {
  team = await labWithTeam();
});
afterAll(async () => {
  await pool.end();
});

describe("GET /api/v1/labs/:slug/settings", () => {
  it("every member reads the settings, with the defaults of a new lab", async () => {
    for (const who of ["manager", "lead", "educator", "operator"] as const) {
      as(team.people[who]);
      const res = await settings("GET");
      expect(res.status).toBe(200);
      expect(res.json).toEqual({
        name: team.lab.name,
        timeZone: "UTC",
        numberFormat: "point",
        contactLine: null,
        isDemo: false,
      });
    }
  });

  it("is 401 for nobody and 404 for a manager of another lab", async () => {
    as(null);
    expect((await settings("GET")).status).toBe(401);
    as(team.people.outsider);
    expect((await settings("GET")).status).toBe(404);
  });
});

describe("PATCH /api/v1/labs/:slug/settings", () => {
  it("refuses every role but the manager (403) and changes nothing", async () => {
    const before = await labRow();
    const audits = await auditCount(team.lab.id);
    for (const who of ["lead", "educator", "operator"] as const) {
      as(team.people[who]);
      expect((await settings("PATCH", { timeZone: "Europe/Berlin" })).status).toBe(403);
    }
    as(team.people.outsider);
    expect((await settings("PATCH", { timeZone: "Europe/Berlin" })).status).toBe(404);
    as(null);
    expect((await settings("PATCH", { timeZone: "Europe/Berlin" })).status).toBe(401);
    expect(await labRow()).toEqual(before);
    expect(await auditCount(team.lab.id)).toBe(audits);
  });

  it.each([
    [{ timeZone: "Mars/Olympus_Mons" }, "timeZone", /IANA/],
    [{ timeZone: 3 }, "timeZone", /text/],
    [{ numberFormat: "dot" }, "numberFormat", /point.*comma/],
    [{ name: "" }, "name", /lab name/i],
    [{ name: "x".repeat(161) }, "name", /160/],
    [{ contactLine: "ask\u202Ethe nurse" }, "contactLine", /direction/],
    [{ contactLine: "line one\nline two" }, "contactLine", /line breaks/],
    [{ contactLine: 7 }, "contactLine", /text/],
    [{ isDemo: false }, "isDemo", /seed/],
    [{ timezone: "UTC" }, "timezone", /Unknown setting/],
  ])("refuses %j with 400 naming %s, changing nothing", async (body, field, message) => {
    as(team.people.manager);
    const before = await labRow();
    const audits = await auditCount(team.lab.id);
    // A good field beside the bad one is not applied either.
    const res = await settings("PATCH", {
      ...body,
      contactLine: (body as { contactLine?: unknown }).contactLine ?? "ok",
    });
    expect(res.status).toBe(400);
    const issue = res.json.error.issues.find((i) => i.path[0] === field);
    expect(issue?.message).toMatch(message);
    expect(await labRow()).toEqual(before);
    expect(await auditCount(team.lab.id)).toBe(audits);
  });

  it("refuses a body that is not JSON (415) or not an object (400)", async () => {
    as(team.people.manager);
    const res = await PATCH(
      new Request(`${env.APP_URL}/api/v1/labs/${team.lab.slug}/settings`, {
        method: "PATCH",
        headers: { origin: new URL(env.APP_URL).origin, "content-type": "text/plain" },
        body: JSON.stringify({ timeZone: "UTC" }),
      }),
      { params: Promise.resolve({ slug: team.lab.slug }) },
    );
    expect(res.status).toBe(415);
    expect((await settings("PATCH", ["timeZone"])).status).toBe(400);
  });

  it("a manager changes some settings; the audit row holds only the changed fields", async () => {
    as(team.people.manager);
    const res = await settings("PATCH", {
      timeZone: "America/Sao_Paulo",
      numberFormat: "comma",
      contactLine: "  ask the charge nurse in the control room ",
      name: team.lab.name,
    });
    expect(res.status).toBe(200);
    expect(res.json.changed.sort()).toEqual(["contactLine", "numberFormat", "timeZone"]);
    expect(res.json.settings).toMatchObject({
      timeZone: "America/Sao_Paulo",
      numberFormat: "comma",
      contactLine: "ask the charge nurse in the control room",
      name: team.lab.name,
    });
    const row = await labRow();
    expect(row).toMatchObject({ timeZone: "America/Sao_Paulo", numberFormat: "comma" });
    const [audit] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, team.lab.id), eq(auditEvents.action, "lab.settings_updated")))
      .orderBy(desc(auditEvents.id));
    expect(audit?.actorUserId).toBe(team.people.manager.id);
    expect(audit?.detail).toEqual({
      before: { timeZone: "UTC", numberFormat: "point", contactLine: null },
      after: {
        timeZone: "America/Sao_Paulo",
        numberFormat: "comma",
        contactLine: "ask the charge nurse in the control room",
      },
    });
  });

  it("the same values again change nothing and write no audit row; an empty contact line clears it", async () => {
    as(team.people.manager);
    const audits = await auditCount(team.lab.id);
    const same = await settings("PATCH", { timeZone: "America/Sao_Paulo" });
    expect(same.json.changed).toEqual([]);
    expect(await auditCount(team.lab.id)).toBe(audits);
    const cleared = await settings("PATCH", { contactLine: "" });
    expect(cleared.json.settings.contactLine).toBeNull();
    expect((await labRow()).contactLine).toBeNull();
  });
});

describe("dates in the lab's time zone", () => {
  it("an invitation e-mail shows its expiry in the zone the manager chose, in the one format", async () => {
    as(team.people.manager);
    expect((await settings("PATCH", { timeZone: "Pacific/Auckland" })).status).toBe(200);
    const email = `${unique("tz")}@example.test`;
    const res = await inviteRoute(
      new Request(`${env.APP_URL}/api/v1/labs/${team.lab.slug}/invitations`, {
        method: "POST",
        headers: { origin: new URL(env.APP_URL).origin, "content-type": "application/json" },
        body: JSON.stringify({ email, role: "operator" }),
      }),
      { params: Promise.resolve({ slug: team.lab.slug }) },
    );
    expect(res.status).toBe(201);
    const { invitation } = (await res.json()) as { invitation: { expiresAt: string } };
    const [mail] = await mailTo(email);
    const expected = formatDateTime(new Date(invitation.expiresAt), "Pacific/Auckland");
    // Auckland is 12 or 13 hours ahead: the UTC wall-clock time would differ.
    expect(expected).not.toBe(formatDateTime(new Date(invitation.expiresAt), "UTC"));
    expect(mail?.text).toContain(`expires at ${expected} (Pacific/Auckland)`);
  });
});
