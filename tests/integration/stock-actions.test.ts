// The stock page's server actions as a manager: the CSV import's preview-then-apply flow with
// its revision check, a file over the limit refused before its bytes are read, a bad file's
// reasons line by line, and form refusals as field errors. Real MariaDB; only the session is set.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, labs } from "@/db/schema";
import type { ImportResult } from "@/lib/stock/import-plan";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { labWithTeam } from "./support/fixtures";
import { as } from "../support/roles";

vi.mock("@/lib/auth/session", () => import("../support/session"));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));

const actions = await import("@/app/(lab)/labs/[slug]/stock/actions");
let team: Awaited<ReturnType<typeof labWithTeam>>;

beforeAll(async () => {
  team = await labWithTeam();
  as(team.people.manager);
});
afterAll(() => pool.end());

const upload = (file: File, fields: Record<string, string> = {}) => {
  const form = new FormData();
  form.set("slug", team.lab.slug);
  form.set("file", file);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return actions.importStockAction({}, form);
};
const csvFile = (text: string, name = "stock.csv") => new File([text], name, { type: "text/csv" });
const revision = async () =>
  (await db.select({ r: labs.stockRevision }).from(labs).where(eq(labs.id, team.lab.id)))[0]!.r;
const families = () =>
  db.select({ name: balloonFamilies.name }).from(balloonFamilies).where(eq(balloonFamilies.labId, team.lab.id));

const GOOD = "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm\nNC action family,nc,2.50,yes,12,20\n";

describe("stock import through the server action", () => {
  it("previews without saving, then applies against the previewed revision", async () => {
    const before = await revision();
    const preview = await upload(csvFile(GOOD), { dryRun: "1" });
    expect(preview).toMatchObject({ ok: true, data: { dryRun: true, applied: false, revision: before } });
    expect((preview.data as ImportResult).plan.familiesToAdd).toHaveLength(1);
    expect(await revision()).toBe(before);
    expect(await families()).toEqual([]);

    const applied = await upload(csvFile(GOOD), { revision: String(before) });
    expect(applied).toMatchObject({ ok: true, data: { applied: true, revision: before + 1 } });
    expect(await families()).toEqual([{ name: "NC action family" }]);
  });

  it("refuses to apply a preview made on an older revision, and changes nothing", async () => {
    const stale = (await revision()) - 1;
    const res = await upload(csvFile(GOOD.replace("yes", "no")), { revision: String(stale) });
    expect(res.ok).toBe(false);
    expect(res.message).toMatch(/changed since/i);
    expect(await revision()).toBe(stale + 1);
  });

  it("refuses a file over the limit from its size, naming the limit", async () => {
    const big = new File([new Uint8Array(MAX_IMPORT_BYTES + 1).fill(0x61)], "big.csv", { type: "text/csv" });
    const read = vi.spyOn(Blob.prototype, "arrayBuffer");
    const res = await upload(big, { dryRun: "1" });
    const reads = read.mock.calls.length;
    read.mockRestore();
    expect(res).toMatchObject({ ok: false });
    expect(res.message).toContain("the limit is 1 MB (1,048,576 bytes). Split it into smaller files.");
    expect(reads).toBe(0);
  });

  it("lists every bad line in order, with the file's own summary", async () => {
    const res = await upload(csvFile("family,compliance,diameter_mm,in_stock\nX,nc,9.00,maybe\n"), { dryRun: "1" });
    expect(res.ok).toBe(false);
    expect(res.message).toBe("1 line has a problem; nothing was imported. Correct the file and try again.");
    expect(res.issues).toEqual([
      "Line 2: diameter_mm: Diameter must be at most 7.00 mm.",
      'Line 2: in_stock: "maybe" is not one of yes, no, y, n, true, false, 1, 0.',
    ]);
  });

  it("asks for a file when none was sent", async () => {
    const form = new FormData();
    form.set("slug", team.lab.slug);
    const res = await actions.importStockAction({}, form);
    expect(res).toMatchObject({ ok: false, fieldErrors: { file: "No file was sent." } });
  });
});

describe("stock forms through the server actions", () => {
  it("returns each field's reason and keeps the values entered", async () => {
    const payload = { slug: team.lab.slug, name: "", compliance: "nc", nominalAtm: 50, rbpAtm: 20 };
    const res = await actions.saveFamilyAction({}, payload);
    expect(res.ok).toBe(false);
    expect(res.message).toBe("Please correct the highlighted fields.");
    expect(res.fieldErrors?.nominalAtm).toBe("Nominal pressure must be at most 40 atm.");
    expect(res.values).toMatchObject({ nominalAtm: 50 });
  });

  it("adds, renames and deletes a platform, each answer naming it", async () => {
    const added = await actions.savePlatformAction({}, { slug: team.lab.slug, name: "DES action platform" });
    expect(added).toMatchObject({ ok: true, message: "Added stent platform DES action platform." });
    const [row] = await db.query.stentPlatforms.findMany({
      where: (t, { eq: is }) => is(t.labId, team.lab.id),
    });
    const renamed = await actions.savePlatformAction(
      {},
      { slug: team.lab.slug, platformId: row!.id, name: "DES action renamed" },
    );
    expect(renamed).toMatchObject({ ok: true, message: "Renamed to DES action renamed." });
    expect(await actions.deletePlatformAction({}, { slug: team.lab.slug, platformId: row!.id })).toMatchObject({
      ok: true,
    });
    expect(await actions.deletePlatformAction({}, { slug: team.lab.slug, platformId: row!.id })).toMatchObject({
      ok: false,
      message: "Stent platform was not found.",
    });
  });
});
