// Walks the server-action rows of the authorization matrix: every actor the row does not allow
// calls the action, with the one signature every action has (previous state, payload), on a
// payload that would work for an allowed member, and nothing may change.
import { and, eq } from "drizzle-orm";
import { PNG } from "pngjs";
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
  labRules,
  labs,
  labTokens,
  logos,
  memberships,
  postings,
  rooms,
  stentPlatforms,
  stentSizes,
  users,
} from "@/db/schema";
import type { ActionPayload, ActionState } from "@/lib/http/action";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { newToken } from "@/lib/auth/tokens";
import { ACTIONS, type Actor } from "../authz/matrix";
import type { Role, Who } from "../support/roles";
import { labWithTeam, unique, stentPlatformFor } from "./support/fixtures";
import { mailTo } from "../support/mail";
import { as } from "../support/roles";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

// The session is the one thing stood in for: who is calling. Everything else is real.
vi.mock("@/lib/auth/session", () => import("../support/session"));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));

type ActionFn = (prev: ActionState, payload: ActionPayload) => Promise<ActionState>;
type Team = Awaited<ReturnType<typeof labWithTeam>>;

let team: Team;
let invitationId: number;
let inviteeEmail: string;
// Chart, editions, room and posting of the fixture lab, for the chart and room actions.
const wall = { familyId: 0, balloonId: 0, chartId: 0, draftId: 0, approvedId: 0, token: "", roomId: 0, postingId: 0 };
const stent = { platformId: 0, sizeId: 0 };

let machineTokenId = 0;

beforeAll(async () => {
  team = await labWithTeam();
  const [tok] = await db
    .insert(labTokens)
    .values({
      labId: team.lab.id,
      name: "Fixture feed",
      scopes: ["stock:read"],
      tokenHash: newToken().hash,
      hint: "fwt_fixture",
    })
    .$returningId();
  machineTokenId = tok!.id;
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
  stentId = await stentPlatformFor(team.lab.id);
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
  wall.balloonId = (
    await db.select({ id: balloons.id }).from(balloons).where(eq(balloons.familyId, wall.familyId)).limit(1)
  )[0]!.id;
  const [platform] = await db
    .insert(stentPlatforms)
    .values({ labId: team.lab.id, name: "DES fixture platform" })
    .$returningId();
  stent.platformId = platform!.id;
  const [size] = await db
    .insert(stentSizes)
    .values({ labId: team.lab.id, platformId: stent.platformId, nominalMm: 3, maxPostDilatationMm: 4 })
    .$returningId();
  stent.sizeId = size!.id;
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
    stentPlatformId: stentId,
    paper: "A3",
    orientation: "landscape",
    readingDistanceM: 1,
  });
}
afterAll(() => pool.end());
beforeEach(() => {
  as(null);
});

const form = (fields: Record<string, string | number | Blob>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v instanceof Blob ? v : String(v));
  return f;
};

const logoPng = () => {
  const img = new PNG({ width: 8, height: 8 });
  img.data.fill(180);
  return new File([new Uint8Array(PNG.sync.write(img))], "logo.png", { type: "image/png" });
};
const csv = () =>
  new File(
    ["family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm\nSC fixture import,sc,2.50,yes,8,14\n"],
    "stock.csv",
    {
      type: "text/csv",
    },
  );

/** The payload each guarded action would accept from a member allowed to run it. */
const INPUTS: Record<string, (t: Team) => ActionPayload> = {
  inviteMemberAction: (t) => form({ slug: t.lab.slug, email: `${unique("new")}@example.test`, role: "educator" }),
  resendInvitationAction: (t) => form({ slug: t.lab.slug, invitationId }),
  revokeInvitationAction: (t) => form({ slug: t.lab.slug, invitationId }),
  changeMemberRoleAction: (t) =>
    form({ slug: t.lab.slug, membershipId: t.people.educator.membershipId, role: "operator" }),
  removeMemberAction: (t) => form({ slug: t.lab.slug, membershipId: t.people.operator.membershipId }),
  joinLabAction: () => form({ token: newToken().token }),
  saveChartAction: (t) => ({
    slug: t.lab.slug,
    chartId: wall.chartId,
    definition: chartDefinition("Renamed fixture chart"),
  }),
  createEditionAction: (t) => ({ slug: t.lab.slug, chartId: wall.chartId }),
  approveEditionAction: (t) => ({ slug: t.lab.slug, editionId: wall.draftId, reviewed: true }),
  rejectEditionAction: (t) => ({ slug: t.lab.slug, editionId: wall.draftId, reason: "Columns too narrow" }),
  withdrawEditionAction: (t) => ({ slug: t.lab.slug, editionId: wall.approvedId, reason: "Wrong family on the wall" }),
  setChartLogoAction: (t) => form({ slug: t.lab.slug, chartId: wall.chartId, file: logoPng() }),
  removeChartLogoAction: (t) => ({ slug: t.lab.slug, chartId: wall.chartId }),
  archiveChartAction: (t) => ({ slug: t.lab.slug, chartId: wall.chartId }),
  restoreChartAction: (t) => ({ slug: t.lab.slug, chartId: wall.chartId }),
  createRoomAction: (t) => form({ slug: t.lab.slug, name: unique("room") }),
  renameRoomAction: (t) => ({ slug: t.lab.slug, roomId: wall.roomId, name: "Renamed room" }),
  archiveRoomAction: (t) => ({ slug: t.lab.slug, roomId: wall.roomId }),
  takeDownAction: (t) => ({ slug: t.lab.slug, postingId: wall.postingId }),
  restorePostingAction: (t) => ({ slug: t.lab.slug, postingId: wall.postingId }),
  recordPostingAction: () => ({ token: wall.token, roomId: wall.roomId }),
  takeDownPostingAction: () => ({ token: wall.token, postingId: wall.postingId }),
  setStaleMailAction: (t) => ({ slug: t.lab.slug, on: true }),
  saveFamilyAction: (t) => ({
    slug: t.lab.slug,
    name: "NC fixture family 2",
    compliance: "nc",
    nominalAtm: 10,
    rbpAtm: 18,
    growthAtRbpMm: null,
  }),
  saveBalloonAction: (t) => ({ slug: t.lab.slug, balloonId: wall.balloonId, inStock: false }),
  savePlatformAction: (t) => ({ slug: t.lab.slug, platformId: stent.platformId, name: "DES fixture renamed" }),
  saveSizeAction: (t) => ({ slug: t.lab.slug, platformId: stent.platformId, nominalMm: 3.5, maxPostDilatationMm: 4.5 }),
  deleteFamilyAction: (t) => ({ slug: t.lab.slug, familyId: wall.familyId }),
  deleteBalloonAction: (t) => ({ slug: t.lab.slug, balloonId: wall.balloonId }),
  deletePlatformAction: (t) => ({ slug: t.lab.slug, platformId: stent.platformId }),
  deleteSizeAction: (t) => ({ slug: t.lab.slug, sizeId: stent.sizeId }),
  importStockAction: (t) => form({ slug: t.lab.slug, file: csv() }),
  stockImpactAction: (t) => ({ slug: t.lab.slug, balloons: [{ id: wall.balloonId, inStock: false }] }),
  // tokens area
  updateLabSettingsAction: (t) =>
    form({ slug: t.lab.slug, name: "Renamed lab", timeZone: "Europe/Berlin", numberFormat: "comma", contactLine: "" }),
  createTokenAction: (t) => ({ slug: t.lab.slug, name: "New feed", scopes: ["stock:read", "stock:write"] }),
  revokeTokenAction: (t) => ({ slug: t.lab.slug, tokenId: machineTokenId }),
  reissueTokenAction: (t) => ({ slug: t.lab.slug, tokenId: machineTokenId }),
  saveLabRulesAction: (t) => ({ slug: t.lab.slug, reviewPeriodMonths: 6, managersMayApprove: true }),
  rulesImpactAction: (t) => ({ slug: t.lab.slug, reviewPeriodMonths: 6, managersMayApprove: true }),
  // onboard
  resendVerificationAction: () => form({}),
  createLabAction: () => form({ name: "Refused lab (illustrative)", slug: unique("refused") }),
  changeNameAction: () => form({ name: "Someone else" }),
  changeEmailAction: () => form({ email: `${unique("moved")}@example.test`, currentPassword: "fixture-password-2026" }),
  changePasswordAction: () =>
    form({ currentPassword: "fixture-password-2026", password: "another long phrase", confirm: "another long phrase" }),
  leaveLabAction: (t) => form({ slug: t.lab.slug }),
  createLadderFamilyAction: (t) => ({
    slug: t.lab.slug,
    name: "Ladder fixture family",
    compliance: "nc",
    nominalAtm: 12,
    rbpAtm: 20,
    diameters: [2, 2.5],
  }),
};

async function snapshot(labId: number) {
  const [m, i, a, u, c, e, r, p] = await Promise.all([
    db.select().from(memberships).where(eq(memberships.labId, labId)),
    db.select().from(invitations).where(eq(invitations.labId, labId)),
    db.select({ id: auditEvents.id }).from(auditEvents).where(eq(auditEvents.labId, labId)),
    db.select({ id: users.id, name: users.name, email: users.email, hash: users.passwordHash }).from(users),
    db.select().from(charts).where(eq(charts.labId, labId)),
    db.select().from(editions).where(eq(editions.labId, labId)),
    db.select().from(rooms).where(eq(rooms.labId, labId)),
    db.select().from(postings).where(eq(postings.labId, labId)),
  ]);
  const [f, b, sp, ss, l, lab] = await Promise.all([
    db.select().from(balloonFamilies).where(eq(balloonFamilies.labId, labId)),
    db.select().from(balloons).where(eq(balloons.labId, labId)),
    db.select().from(stentPlatforms).where(eq(stentPlatforms.labId, labId)),
    db.select().from(stentSizes).where(eq(stentSizes.labId, labId)),
    db.select({ id: logos.id }).from(logos).where(eq(logos.labId, labId)),
    db
      .select({
        revision: labs.stockRevision,
        name: labs.name,
        timeZone: labs.timeZone,
        numberFormat: labs.numberFormat,
        contactLine: labs.contactLine,
      })
      .from(labs)
      .where(eq(labs.id, labId)),
  ]);
  return {
    memberships: m,
    invitations: i,
    audit: a.length,
    users: u,
    labCount: (await db.select({ id: labs.id }).from(labs)).length,
    mail: (await mailTo(inviteeEmail)).length,
    charts: c,
    editions: e,
    rooms: r,
    postings: p,
    stock: { families: f, balloons: b, platforms: sp, sizes: ss, revision: lab[0]?.revision },
    logos: l.length,
    settings: lab[0] && { ...lab[0], revision: undefined },
    tokens: await db.select().from(labTokens).where(eq(labTokens.labId, labId)),
  };
}

const actorsRefused = (allowed: readonly string[]): Who[] => {
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
  "app/(lab)/labs/[slug]/stock/actions.ts": () => import("@/app/(lab)/labs/[slug]/stock/actions"),
  "app/(lab)/labs/[slug]/settings/actions.ts": () => import("@/app/(lab)/labs/[slug]/settings/actions"),
  "app/(lab)/labs/[slug]/rules/actions.ts": () => import("@/app/(lab)/labs/[slug]/rules/actions"),
  "lib/auth/sign-up-actions.ts": () => import("@/lib/auth/sign-up-actions"),
  "app/(lab)/labs/new/actions.ts": () => import("@/app/(lab)/labs/new/actions"),
  "app/(lab)/account/actions.ts": () => import("@/app/(lab)/account/actions"),
  "app/(lab)/labs/[slug]/stock/ladder/actions.ts": () => import("@/app/(lab)/labs/[slug]/stock/ladder/actions"),
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
        as(actor === "anonymous" ? null : team.people[actor]);
        const before = await snapshot(team.lab.id);
        const result = await mod[row.name]!({}, INPUTS[row.name]!(team));
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
    as(team.people.manager);
    const before = await snapshot(team.lab.id);
    const result = await mod.changeMemberRoleAction!({}, INPUTS.changeMemberRoleAction!(team));
    expect(result).toMatchObject({ ok: true });
    const after = await snapshot(team.lab.id);
    expect(after).not.toEqual(before);
    const [m] = await db
      .select()
      .from(memberships)
      .where(and(eq(memberships.labId, team.lab.id), eq(memberships.id, team.people.educator.membershipId)));
    expect(m?.role).toBe("operator");
  });

  it("chart, room, posting and stock actions do change things for an allowed member", async () => {
    // Not the educator: the test above made them an operator.
    const runAction = async (file: string, name: string, who: Role) => {
      const mod = (await MODULES[file]!()) as Record<string, ActionFn>;
      as(team.people[who]);
      return mod[name]!({}, INPUTS[name]!(team));
    };
    const before = await snapshot(team.lab.id);
    expect(await runAction("app/(lab)/labs/[slug]/rooms/actions.ts", "createRoomAction", "manager")).toMatchObject({
      ok: true,
    });
    expect(await runAction("app/(lab)/labs/[slug]/charts/actions.ts", "approveEditionAction", "lead")).toMatchObject({
      ok: true,
    });
    expect(await runAction("app/(public)/v/[token]/actions.ts", "takeDownPostingAction", "operator")).toMatchObject({
      ok: true,
    });
    const STOCK = "app/(lab)/labs/[slug]/stock/actions.ts";
    expect(await runAction(STOCK, "saveBalloonAction", "manager")).toMatchObject({ ok: true });
    expect(await runAction(STOCK, "saveSizeAction", "manager")).toMatchObject({ ok: true });
    expect(await runAction(STOCK, "importStockAction", "manager")).toMatchObject({ ok: true, data: { applied: true } });
    expect(await runAction("app/(lab)/labs/[slug]/charts/actions.ts", "setChartLogoAction", "manager")).toMatchObject({
      ok: true,
    });
    expect(await runAction("app/(lab)/labs/[slug]/rules/actions.ts", "saveLabRulesAction", "lead")).toMatchObject({
      ok: true,
      data: { revision: 1 },
    });
    const [rules] = await db.select().from(labRules).where(eq(labRules.labId, team.lab.id));
    expect(rules?.rules).toMatchObject({ reviewPeriodMonths: 6, managersMayApprove: true });
    const after = await snapshot(team.lab.id);
    expect(after.stock.balloons.find((b) => b.id === wall.balloonId)?.inStock).toBe(false);
    expect(after.stock.sizes.length).toBe(before.stock.sizes.length + 1);
    expect(after.stock.families.map((f) => f.name)).toContain("SC fixture import");
    expect(after.logos).toBe(before.logos + 1);
    expect(after.rooms.length).toBe(before.rooms.length + 1);
    expect(after.editions.find((e) => e.id === wall.draftId)?.status).toBe("approved");
    expect(after.postings.find((p) => p.id === wall.postingId)?.removedAt).not.toBeNull();
  });
});
