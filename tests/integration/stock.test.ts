// Stock queries on the real MariaDB test database, in labs of their own so nothing else is disturbed.
import { eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { afterStockChange, getStock, listStockHistory } from "@/db/queries/stock";
import {
  createBalloon,
  createBalloonFamily,
  createStentPlatform,
  createStentSize,
  deleteBalloon,
  deleteBalloonFamily,
  deleteStentPlatform,
  deleteStentSize,
  importBalloons,
  updateBalloon,
  updateBalloonFamily,
  updateStentPlatform,
  updateStentSize,
} from "./support/writes";
import { labs, users } from "@/db/schema";
import { parseBalloonCsv } from "@/lib/stock/csv";
import { balloonFamilyInput, balloonInput, stentSizeInput } from "@/lib/validation/stock";
import { refusal } from "../support/refusal";
import { auditCount } from "../support/audit";

const run = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
let labId = 0;
let otherLabId = 0;
let actorUserId = 0;

afterAll(async () => {
  await db.delete(labs).where(like(labs.slug, `stock-it-${run}%`));
  await db.delete(users).where(eq(users.email, `stock-it-${run}@forkwall.test`));
  await pool.end();
});

beforeAll(async () => {
  const [lab] = await db
    .insert(labs)
    .values({ slug: `stock-it-${run}`, name: "Stock test lab (illustrative)" })
    .$returningId();
  const [other] = await db
    .insert(labs)
    .values({ slug: `stock-it-${run}-other`, name: "Other test lab (illustrative)" })
    .$returningId();
  const [user] = await db
    .insert(users)
    .values({ email: `stock-it-${run}@forkwall.test`, name: "Stock tester", passwordHash: "x" })
    .$returningId();
  labId = lab!.id;
  otherLabId = other!.id;
  actorUserId = user!.id;
});

const actor = () => ({ labId, actorUserId });
const family = (name: string, extra: Record<string, unknown> = {}) =>
  balloonFamilyInput.parse({ name, compliance: "nc", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2, ...extra });
const lastAudit = async () => (await listStockHistory({ labId, limit: 1 }))[0]!;

/** Everything a refused change must leave untouched: the whole stock, the revision and the audit trail. */
async function unchanged<T>(fn: () => Promise<T>, lab = labId): Promise<T> {
  const before = { stock: await getStock({ labId: lab }), audits: await auditCount(lab, "stock.") };
  const result = await fn();
  expect({ stock: await getStock({ labId: lab }), audits: await auditCount(lab, "stock.") }).toEqual(before);
  return result;
}

describe("balloon families and balloons", () => {
  it("creating a family bumps the revision by one and audits before/after in the same change", async () => {
    const rev0 = (await getStock({ labId })).revision;
    const { revision, family: created } = await createBalloonFamily({
      ...actor(),
      input: family("NC test family (illustrative)"),
    });
    expect(revision).toBe(rev0 + 1);
    expect(created).toMatchObject({
      name: "NC test family (illustrative)",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: 0.2,
      balloons: [],
    });
    const audit = await lastAudit();
    expect(audit.action).toBe("stock.family.create");
    expect(audit.actorName).toBe("Stock tester");
    expect(audit.detail).toMatchObject({
      revision,
      before: null,
      after: { name: "NC test family (illustrative)", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2 },
    });
  });

  it("GET shape: numbers as numbers, balloons sorted by diameter", async () => {
    const fam = (await getStock({ labId })).balloonFamilies[0]!;
    for (const d of [3.5, 2.25, 3])
      await createBalloon({ ...actor(), familyId: fam.id, input: balloonInput.parse({ diameterMm: d }) });
    const stock = await getStock({ labId });
    const json = JSON.parse(JSON.stringify(stock));
    expect(json.balloonFamilies[0].balloons.map((b: { diameterMm: unknown }) => b.diameterMm)).toEqual([2.25, 3, 3.5]);
    expect(typeof json.balloonFamilies[0].nominalAtm).toBe("number");
    expect(Object.keys(json).sort()).toEqual(["balloonFamilies", "revision", "stentPlatforms"]);
    expect(Object.keys(json.balloonFamilies[0]).sort()).toEqual([
      "balloons",
      "compliance",
      "growthAtRbpMm",
      "id",
      "name",
      "nominalAtm",
      "rbpAtm",
    ]);
    expect(Object.keys(json.balloonFamilies[0].balloons[0]).sort()).toEqual(["diameterMm", "id", "inStock"]);
  });

  it("duplicates are refused with 409 and a clear message, changing nothing", async () => {
    const fam = (await getStock({ labId })).balloonFamilies[0]!;
    const dupName = await unchanged(() =>
      refusal(createBalloonFamily({ ...actor(), input: family("nc TEST family (illustrative)") })),
    );
    expect(dupName).toMatchObject({
      status: 409,
      message: 'This lab already has a balloon family named "NC test family (illustrative)".',
    });
    const dupSize = await unchanged(() =>
      refusal(createBalloon({ ...actor(), familyId: fam.id, input: balloonInput.parse({ diameterMm: 3.0 }) })),
    );
    expect(dupSize).toMatchObject({
      status: 409,
      message: "NC test family (illustrative) already has a 3.00 mm balloon.",
    });
    const moved = await unchanged(() =>
      refusal(updateBalloon({ ...actor(), balloonId: fam.balloons[0]!.id, patch: { diameterMm: 3.5 } })),
    );
    expect(moved.status).toBe(409);
  });

  it("marking out of stock is one revision and an audit with before/after; repeating it changes nothing", async () => {
    const fam = (await getStock({ labId })).balloonFamilies[0]!;
    const target = fam.balloons.find((b) => b.diameterMm === 3)!;
    const rev = (await getStock({ labId })).revision;
    const out = await updateBalloon({ ...actor(), balloonId: target.id, patch: { inStock: false } });
    expect(out).toMatchObject({
      revision: rev + 1,
      changed: true,
      balloon: { id: target.id, diameterMm: 3, inStock: false },
    });
    expect((await lastAudit()).detail).toMatchObject({
      before: { family: fam.name, diameterMm: 3, inStock: true },
      after: { family: fam.name, diameterMm: 3, inStock: false },
      summary: `Marked ${fam.name} 3.00 mm out of stock`,
    });
    const again = await unchanged(() => updateBalloon({ ...actor(), balloonId: target.id, patch: { inStock: false } }));
    expect(again).toMatchObject({ revision: rev + 1, changed: false });
  });

  it("a patch is checked against the merged family: nominal must stay below the recorded burst", async () => {
    const fam = (await getStock({ labId })).balloonFamilies[0]!;
    const err = await unchanged(() =>
      refusal(updateBalloonFamily({ ...actor(), familyId: fam.id, patch: { nominalAtm: 20 } })),
    );
    expect(err.status).toBe(400);
    expect(err.issues).toEqual([
      { path: ["rbpAtm"], message: "Rated burst pressure must be above the nominal pressure." },
    ]);
    const ok = await updateBalloonFamily({
      ...actor(),
      familyId: fam.id,
      patch: { nominalAtm: 14, growthAtRbpMm: null },
    });
    expect(ok.family).toMatchObject({ nominalAtm: 14, growthAtRbpMm: null });
    expect((await lastAudit()).detail).toMatchObject({
      before: { nominalAtm: 12, growthAtRbpMm: 0.2 },
      after: { nominalAtm: 14, growthAtRbpMm: null },
    });
  });

  it("ids from another lab are 404 and touch neither lab", async () => {
    const fam = (await getStock({ labId })).balloonFamilies[0]!;
    const b = fam.balloons[0]!;
    const other = { labId: otherLabId, actorUserId };
    await unchanged(async () => {
      await unchanged(async () => {
        expect(
          (await refusal(updateBalloonFamily({ ...other, familyId: fam.id, patch: { name: "Stolen" } }))).status,
        ).toBe(404);
        expect((await refusal(deleteBalloonFamily({ ...other, familyId: fam.id }))).status).toBe(404);
        expect(
          (await refusal(createBalloon({ ...other, familyId: fam.id, input: balloonInput.parse({ diameterMm: 4 }) })))
            .status,
        ).toBe(404);
        expect((await refusal(updateBalloon({ ...other, balloonId: b.id, patch: { inStock: false } }))).status).toBe(
          404,
        );
        expect((await refusal(deleteBalloon({ ...other, balloonId: b.id }))).message).toBe("Balloon was not found.");
      }, otherLabId);
    });
  });

  it("deleting a family removes its balloons and audits what they were", async () => {
    const { family: temp } = await createBalloonFamily({ ...actor(), input: family("Temp family (illustrative)") });
    await createBalloon({
      ...actor(),
      familyId: temp.id,
      input: balloonInput.parse({ diameterMm: 2.5, inStock: false }),
    });
    const rev = (await getStock({ labId })).revision;
    const res = await deleteBalloonFamily({ ...actor(), familyId: temp.id });
    expect(res.revision).toBe(rev + 1);
    expect((await getStock({ labId })).balloonFamilies.map((f) => f.name)).not.toContain("Temp family (illustrative)");
    expect((await lastAudit()).detail).toMatchObject({
      before: { name: "Temp family (illustrative)", balloons: [{ diameterMm: 2.5, inStock: false }] },
      after: null,
    });
  });
});

describe("stent platforms and sizes", () => {
  it("create, rename, size rules, duplicates, cross-lab and delete", async () => {
    const { platform } = await createStentPlatform({ ...actor(), input: { name: "DES test platform (illustrative)" } });
    expect(
      (await refusal(createStentPlatform({ ...actor(), input: { name: "des test platform (illustrative)" } }))).status,
    ).toBe(409);
    const { size } = await createStentSize({
      ...actor(),
      platformId: platform.id,
      input: stentSizeInput.parse({ nominalMm: 3, maxPostDilatationMm: 4.5 }),
    });
    expect(size).toMatchObject({ nominalMm: 3, maxPostDilatationMm: 4.5 });
    expect(
      (
        await refusal(
          createStentSize({
            ...actor(),
            platformId: platform.id,
            input: stentSizeInput.parse({ nominalMm: 3, maxPostDilatationMm: 4 }),
          }),
        )
      ).status,
    ).toBe(409);

    // Only the max is sent: the rule is checked against the recorded nominal.
    const tooFar = await unchanged(() =>
      refusal(updateStentSize({ ...actor(), sizeId: size.id, patch: { maxPostDilatationMm: 5.5 } })),
    );
    expect(tooFar.issues?.[0]?.message).toBe(
      "Maximum post-dilatation diameter must be at most nominal + 2.00 mm (5.00 mm).",
    );
    const ok = await updateStentSize({ ...actor(), sizeId: size.id, patch: { maxPostDilatationMm: 5 } });
    expect(ok.size.maxPostDilatationMm).toBe(5);
    expect((await lastAudit()).detail).toMatchObject({
      before: { maxPostDilatationMm: 4.5 },
      after: { maxPostDilatationMm: 5 },
    });

    expect(
      (
        await refusal(
          updateStentSize({ labId: otherLabId, actorUserId, sizeId: size.id, patch: { maxPostDilatationMm: 4 } }),
        )
      ).status,
    ).toBe(404);
    expect(
      (await refusal(deleteStentPlatform({ labId: otherLabId, actorUserId, platformId: platform.id }))).status,
    ).toBe(404);

    const renamed = await updateStentPlatform({
      ...actor(),
      platformId: platform.id,
      input: { name: "DES renamed (illustrative)" },
    });
    expect(renamed.platform.name).toBe("DES renamed (illustrative)");
    await deleteStentSize({ ...actor(), sizeId: size.id });
    expect((await getStock({ labId })).stentPlatforms[0]!.sizes).toEqual([]);
    const rev = (await getStock({ labId })).revision;
    await deleteStentPlatform({ ...actor(), platformId: platform.id });
    expect((await getStock({ labId })).revision).toBe(rev + 1);
    expect((await getStock({ labId })).stentPlatforms).toEqual([]);
  });
});

describe("afterStockChange", () => {
  it("bumps the revision inside the caller's transaction and rolls back with it", async () => {
    const rev = (await getStock({ labId })).revision;
    await expect(
      db.transaction(async (tx) => {
        expect(await afterStockChange(tx, { labId, actorUserId, summary: "test" })).toBe(rev + 1);
        throw new Error("abort");
      }),
    ).rejects.toThrow("abort");
    expect((await getStock({ labId })).revision).toBe(rev);
  });
});

describe("CSV import", () => {
  const rowsOf = (csv: string) => {
    const parsed = parseBalloonCsv(csv);
    expect(parsed.issues).toEqual([]);
    return parsed.rows;
  };
  const FILE = [
    "family;compliance;diameter_mm;in_stock;nominal_atm;rbp_atm;growth_at_rbp_mm",
    "NC test family (illustrative);nc;2,25;no;;;", // in -> out
    "NC test family (illustrative);nc;3,00;yes;;;", // out -> in ; 3.50 missing -> marked out
    "NC test family (illustrative);nc;4,00;yes;;;", // new size
    "Imported family (illustrative);sc;2,00;yes;8;14;", // new family
    "Imported family (illustrative);sc;2,50;no;;;",
  ].join("\r\n");

  it("a dry run returns the plan and changes nothing at all", async () => {
    const result = await unchanged(() => importBalloons({ ...actor(), rows: rowsOf(FILE), dryRun: true }));
    expect(result).toMatchObject({
      dryRun: true,
      applied: false,
      summary: "1 family added, 3 sizes added, 2 sizes changed, 1 size marked out of stock",
    });
    expect(result.revision).toBe((await getStock({ labId })).revision);
  });

  it("a bad line refuses the whole file, and a failure mid-apply rolls everything back", async () => {
    const missingPressures = rowsOf(
      "family,compliance,diameter_mm,in_stock\nNC test family (illustrative),nc,2.25,no\nBrand new (illustrative),nc,2.0,yes\n",
    );
    const bad = await unchanged(() => refusal(importBalloons({ ...actor(), rows: missingPressures, dryRun: false })));
    expect(bad.status).toBe(400);
    expect(bad.issues).toEqual([
      {
        path: ["line", 3],
        message:
          "Line 3: Brand new (illustrative) is a new family: give its nominal_atm and rbp_atm (on at least one of its lines).",
      },
    ]);

    // The database's accent-insensitive collation sees "Nç test..." as the existing family, the
    // planner does not: the insert fails after other rows were written, and all of it is undone.
    const clash = rowsOf(
      [
        "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm",
        "AAA first new (illustrative),nc,2.0,yes,12,20",
        "NC test family (illustrative),nc,2.25,no,,",
        "Nç test family (illustrative),nc,2.0,yes,12,20",
      ].join("\n"),
    );
    const failed = await unchanged(() => refusal(importBalloons({ ...actor(), rows: clash, dryRun: false })));
    expect(failed.status).toBe(409);
    expect((await getStock({ labId })).balloonFamilies.map((f) => f.name)).not.toContain(
      "AAA first new (illustrative)",
    );
  });

  it("applying is one transaction: one revision bump and one audit event with before and after", async () => {
    const before = await getStock({ labId });
    const audits = await auditCount(labId, "stock.");
    const stale = await unchanged(() =>
      refusal(importBalloons({ ...actor(), rows: rowsOf(FILE), dryRun: false, expectRevision: before.revision - 1 })),
    );
    expect(stale.status).toBe(409);

    const result = await importBalloons({
      ...actor(),
      rows: rowsOf(FILE),
      dryRun: false,
      expectRevision: before.revision,
      fileName: "stock.csv",
    });
    expect(result).toMatchObject({ applied: true, revision: before.revision + 1 });
    const after = await getStock({ labId });
    expect(after.revision).toBe(before.revision + 1);
    expect(await auditCount(labId, "stock.")).toBe(audits + 1);

    const nc = after.balloonFamilies.find((f) => f.name === "NC test family (illustrative)")!;
    expect(nc.balloons.map((b) => [b.diameterMm, b.inStock])).toEqual([
      [2.25, false],
      [3, true],
      [3.5, false],
      [4, true],
    ]);
    const imported = after.balloonFamilies.find((f) => f.name === "Imported family (illustrative)")!;
    expect(imported).toMatchObject({ compliance: "sc", nominalAtm: 8, rbpAtm: 14, growthAtRbpMm: null });
    expect(imported.balloons.map((b) => [b.diameterMm, b.inStock])).toEqual([
      [2, true],
      [2.5, false],
    ]);

    const audit = await lastAudit();
    expect(audit.action).toBe("stock.import");
    const detail = audit.detail as {
      summary: string;
      revision: number;
      before: { families: { name: string }[] };
      after: { families: { name: string; balloons: unknown[] }[] };
    };
    expect(detail.summary).toBe(
      "Imported stock.csv: 1 family added, 3 sizes added, 2 sizes changed, 1 size marked out of stock",
    );
    expect(detail.revision).toBe(before.revision + 1);
    expect(detail.before.families.map((f) => f.name)).toEqual(["NC test family (illustrative)"]);
    expect(detail.after.families.map((f) => f.name).sort()).toEqual([
      "Imported family (illustrative)",
      "NC test family (illustrative)",
    ]);

    // The same file again plans nothing and applies nothing.
    const again = await unchanged(() => importBalloons({ ...actor(), rows: rowsOf(FILE), dryRun: false }));
    expect(again).toMatchObject({ applied: false, summary: "no changes" });
  });

  // How long this takes is measured by `npm run bench:stock` (tests/bench/stock-import.ts).
  it("imports a file of the 5,000-row limit whole", async () => {
    const lines = ["family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm"];
    for (let f = 0; f < 50; f++)
      for (let i = 0; i < 100; i++)
        lines.push(
          `Bulk ${String(f).padStart(2, "0")} (illustrative),nc,${(1 + i * 0.05).toFixed(2)},${i % 7 ? "yes" : "no"},12,20`,
        );
    const rows = rowsOf(lines.join("\n"));
    const preview = await importBalloons({ ...actor(), rows, dryRun: true });
    const result = await importBalloons({ ...actor(), rows, dryRun: false, expectRevision: preview.revision });
    expect(result.plan.balloonsToAdd).toHaveLength(5000);
    expect(
      (await getStock({ labId })).balloonFamilies.filter((f) => f.name.startsWith("Bulk")).flatMap((f) => f.balloons),
    ).toHaveLength(5000);
  }, 60_000);
});
