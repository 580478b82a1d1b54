// Every lab operation refuses, by itself, a caller whose role lacks its capability, an anonymous
// caller and a member of another lab, before it reads its input or changes anything. The routes
// and actions above it are walked separately (tests/e2e/authz.spec.ts, actions-authz.test.ts).
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, charts, editions } from "@/db/schema";
import { AppError } from "@/lib/errors";
import * as accountSettings from "@/lib/ops/account-settings";
import * as audit from "@/lib/ops/audit";
import * as chartsOps from "@/lib/ops/charts";
import * as editionsOps from "@/lib/ops/editions";
import * as firstRunOps from "@/lib/ops/first-run";
import * as labRulesOps from "@/lib/ops/lab-rules";
import * as members from "@/lib/ops/members";
import * as postings from "@/lib/ops/postings";
import * as renders from "@/lib/ops/renders";
import * as stock from "@/lib/ops/stock";
import * as labSettingsOps from "@/lib/ops/lab-settings";
import * as tokensOps from "@/lib/ops/tokens";
import type { Caller } from "@/lib/ops/caller";
import { can, ROLES, type Capability } from "@/lib/permissions";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { createChart, createEdition } from "./support/writes";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

type Op = ((caller: Caller, ref: Record<string, unknown>, input?: unknown) => Promise<unknown>) & {
  operation: string;
  capability: Capability;
  scope: "lab" | "chart" | "edition";
  machine: "stock:read" | "stock:write" | null;
};

const ops: Op[] = [
  accountSettings,
  audit,
  chartsOps,
  editionsOps,
  firstRunOps,
  labRulesOps,
  members,
  postings,
  renders,
  stock,
  labSettingsOps,
  tokensOps,
].flatMap((mod) => Object.values(mod).filter((v): v is Op => typeof v === "function" && "capability" in v));

let team: Awaited<ReturnType<typeof labWithTeam>>;
const ids = { chartId: 0, editionId: 0 };

const callerOf = (p: { id: number; email: string; name: string }): Caller => ({
  kind: "user",
  user: { id: p.id, email: p.email, name: p.name },
});

async function footprint() {
  const [a] = await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.labId, team.lab.id));
  const [e] = await db.select({ n: count() }).from(editions).where(eq(editions.labId, team.lab.id));
  const [c] = await db.select({ n: count() }).from(charts).where(eq(charts.labId, team.lab.id));
  return { audit: a!.n, editions: e!.n, charts: c!.n };
}

function refFor(op: Op) {
  const base =
    op.scope === "lab"
      ? { lab: team.lab.slug }
      : op.scope === "chart"
        ? { chartId: ids.chartId }
        : { editionId: ids.editionId };
  // Further ids name rows that need not exist: refusal comes before any lookup of them.
  return new Proxy(base as Record<string, unknown>, { get: (t, k: string) => (k in t ? t[k] : 1) });
}

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC ops", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: null })
    .$returningId();
  const definition = chartDefinitionSchema.parse({
    title: "Ops refusals",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId: fam!.id, rounding: "up", rows: [3, 3.5], cols: [2, 2.5] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
  });
  ids.chartId = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition })).id;
  ids.editionId = (await createEdition({ labId: team.lab.id, chartId: ids.chartId, actor: team.people.educator })).id;
});

afterAll(() => pool.end());

describe("the operations layer refuses by itself", () => {
  it("finds every lab operation", () => {
    expect(ops.length).toBeGreaterThanOrEqual(30);
  });

  it("answers anonymous 401, another lab's manager 404 and each role without the capability 403, changing nothing", async () => {
    const before = await footprint();
    let refusals = 0;
    for (const op of ops) {
      const tries: { caller: Caller; status: number }[] = [
        { caller: { kind: "anonymous" }, status: 401 },
        { caller: callerOf(team.people.outsider), status: 404 },
        ...ROLES.filter((r) => !can(r, op.capability)).map((r) => ({
          caller: callerOf(team.people[r]),
          status: 403,
        })),
      ];
      for (const t of tries) {
        const err = await op(t.caller, refFor(op), {}).then(
          () => null,
          (e: unknown) => e,
        );
        expect(err, `${op.operation} as ${t.caller.kind}`).toBeInstanceOf(AppError);
        expect((err as AppError).status, `${op.operation} expected ${t.status}`).toBe(t.status);
        refusals++;
      }
    }
    expect(refusals).toBeGreaterThan(ops.length * 2);
    expect(await footprint()).toEqual(before);
  });

  it("answers a machine token of another lab 404, and one of this lab 403 outside its scopes, changing nothing", async () => {
    const before = await footprint();
    const token = (labId: number, labSlug: string, scopes: ("stock:read" | "stock:write")[]): Caller => ({
      kind: "token",
      token: { id: 1, name: "ops walker", scopes, labId, labSlug },
    });
    const foreign = token(team.other.id, team.other.slug, ["stock:read", "stock:write"]);
    let refusals = 0;
    for (const op of ops) {
      const own = token(team.lab.id, team.lab.slug, op.machine === "stock:read" ? ["stock:write"] : ["stock:read"]);
      for (const [caller, status] of [
        [foreign, 404],
        [own, 403],
      ] as const) {
        const err = await op(caller, refFor(op), {}).then(
          () => null,
          (e: unknown) => e,
        );
        expect((err as AppError).status, `${op.operation} as a token, expected ${status}`).toBe(status);
        refusals++;
      }
    }
    expect(refusals).toBe(ops.length * 2);
    // Only stock operations are open to tokens at all.
    expect(ops.filter((o) => o.machine).every((o) => o.operation.startsWith("stock."))).toBe(true);
    expect(await footprint()).toEqual(before);
  });

  it("answers a malformed id with 404, like an id of another lab", async () => {
    for (const balloonId of ["x1", "0", "-3", "1.5", 2 ** 60]) {
      const err = await stock
        .updateBalloon(callerOf(team.people.manager), { lab: team.lab.slug, balloonId }, { inStock: false })
        .then(
          () => null,
          (e: unknown) => e,
        );
      expect((err as AppError).status, String(balloonId)).toBe(404);
    }
  });
});
