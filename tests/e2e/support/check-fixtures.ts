// Copies of the demo POT chart with editions in every state, inserted straight into the test
// database (the immutability triggers guard updates, not inserts), for the check page's tests.
// They live in a lab of their own (an archived chart's copies read "take down"), so the demo
// lab's chart lists and settings stay as the other tests expect.
import { randomBytes } from "node:crypto";
import { newShortCode } from "@/lib/editions/short-code";
import { demoIds, query } from "./db";

export type Fixture = { token: string; shortCode: string };
export type CheckFixtures = Record<
  "current" | "review" | "outdated" | "superseded" | "withdrawn" | "draft",
  Fixture
> & { replacementNumber: number; labSlug: string };

type Snap = { lookups: { family: { diameters: number[] } | null }[] };

async function fixtureLab(slug: string): Promise<number> {
  await query("INSERT INTO labs (slug, name, is_demo) VALUES (?, ?, 1)", [slug, "Phone fixture lab (illustrative)"]);
  const [row] = await query<{ id: number }>("SELECT id FROM labs WHERE slug = ?", [slug]);
  return Number(row!.id);
}

async function copyChart(labId: number, fromChart: number, title: string): Promise<number> {
  await query(
    `INSERT INTO charts (lab_id, title, definition, logo_id, live_fingerprint, live_snapshot, live_changed_at, created_by)
     SELECT ?, ?, definition, NULL, live_fingerprint, live_snapshot, NOW(), created_by FROM charts WHERE id = ?`,
    [labId, title, fromChart],
  );
  const [row] = await query<{ id: number }>("SELECT MAX(id) AS id FROM charts WHERE title = ?", [title]);
  return Number(row!.id);
}

async function addEdition(
  chartId: number,
  number: number,
  status: string,
  snapshot: unknown,
  fingerprint: string,
  extra: { reviewBy?: string } = {},
): Promise<Fixture> {
  const token = randomBytes(18).toString("base64url");
  const shortCode = newShortCode();
  const approved = status === "draft" ? null : "2026-11-20 09:00:00";
  await query(
    `INSERT INTO editions (lab_id, chart_id, number, status, snapshot, fingerprint, check_token, short_code, approved_at, approved_by_name, superseded_at, withdrawn_at, review_by)
     SELECT lab_id, id, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ? FROM charts WHERE id = ?`,
    [
      number,
      status,
      JSON.stringify(snapshot),
      fingerprint,
      token,
      shortCode,
      approved,
      approved ? "Fixture approver" : null,
      status === "superseded" ? "2026-11-25 09:00:00" : null,
      status === "withdrawn" ? "2026-11-26 09:00:00" : null,
      extra.reviewBy ?? (approved ? "2027-11-20 09:00:00" : null),
      chartId,
    ],
  );
  return { token, shortCode };
}

/** One printed copy per status; the stale ones print one size (3.75 mm) the chart no longer uses. */
export async function makeCheckFixtures(): Promise<CheckFixtures> {
  const ids = await demoIds();
  const [pot] = await query<{ snapshot: string | Snap; fingerprint: string; live_fingerprint: string }>(
    "SELECT e.snapshot, e.fingerprint, c.live_fingerprint FROM editions e JOIN charts c ON c.id = e.chart_id WHERE e.id = ?",
    [ids["edition:pot"]],
  );
  const live = (typeof pot!.snapshot === "string" ? JSON.parse(pot!.snapshot) : pot!.snapshot) as Snap;
  // An older printing: the family then also held 3.6 mm, so some cells printed 3.6 instead of 3.75.
  const older = structuredClone(live);
  for (const l of older.lookups) if (l.family) l.family.diameters = [...l.family.diameters, 3.6].sort((a, b) => a - b);
  const stale = "f".repeat(64);
  const suffix = randomBytes(3).toString("hex");
  const labSlug = `phone-fixtures-${suffix}`;
  const lab = await fixtureLab(labSlug);

  const a = await copyChart(lab, Number(ids["chart:pot"]), `Phone fixture A ${suffix}`);
  const current = await addEdition(a, 5, "approved", live, pot!.live_fingerprint);
  const superseded = await addEdition(a, 4, "superseded", older, stale);
  const withdrawn = await addEdition(a, 3, "withdrawn", older, stale);
  const draft = await addEdition(a, 6, "draft", older, stale);

  const b = await copyChart(lab, Number(ids["chart:pot"]), `Phone fixture B ${suffix}`);
  const outdated = await addEdition(b, 1, "approved", older, stale);
  const c = await copyChart(lab, Number(ids["chart:pot"]), `Phone fixture C ${suffix}`);
  const review = await addEdition(c, 1, "approved", live, pot!.live_fingerprint, { reviewBy: "2026-01-01 00:00:00" });
  return { current, review, outdated, superseded, withdrawn, draft, replacementNumber: 5, labSlug };
}
