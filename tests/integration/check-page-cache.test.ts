// The check page's cache (lib/http/check-page.ts) against the real MariaDB: after every kind of
// change that can alter what a scan says (lab settings, stock, a waiting draft, an approval, the
// review-by date passing, a withdrawal, archiving), the page served equals a page built from
// scratch, and with no change in between the built page is reused.
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { getCheckByToken } from "@/lib/ops/check";
import { setChartArchived } from "@/db/queries/charts";
import { updateLabSettings } from "@/db/queries/lab-settings";
import { editions } from "@/db/schema";
import { checkPageHtml } from "@/lib/editions/check-html";
import { checkPageFor, checkPageModel } from "@/lib/http/check-page";
import { labWrite } from "@/lib/ops/write";
import { approveEdition, createEdition, deleteBalloon, labWithSmallChart, withdrawEdition } from "./support/writes";

let team: Awaited<ReturnType<typeof labWithSmallChart>>["team"];
let chartId = 0;
let balloonIds: number[] = [];

beforeAll(async () => {
  ({ team, chartId, balloonIds } = await labWithSmallChart({ name: "Cache" }));
});

afterEach(() => vi.useRealTimers());
afterAll(() => pool.end());

const actor = (who: "educator" | "lead" | "manager") => ({ id: team.people[who].id, name: team.people[who].name });
const newEdition = async () =>
  (await createEdition({ labId: team.lab.id, chartId, actor: actor("educator") })) as { id: number };
const tokenOf = async (id: number) =>
  (await db.select({ t: editions.checkToken }).from(editions).where(eq(editions.id, id)))[0]!.t;

/** The served page, checked against one built from scratch now. */
async function served(token: string) {
  const page = await checkPageFor(token);
  const view = await getCheckByToken({ token });
  expect(page).not.toBeNull();
  expect(page!.html).toBe(checkPageHtml(checkPageModel(view!, token)));
  return page!;
}

describe("the check page's cache", () => {
  it("serves what a fresh build would after every kind of change, and reuses a page while nothing changed", async () => {
    const first = await newEdition();
    const t1 = await tokenOf(first.id);
    const draftPage = await served(t1);
    expect(draftPage.html).toContain("Draft");

    await approveEdition({ labId: team.lab.id, editionId: first.id, actor: actor("lead") });
    const kept = await served(t1);
    expect(kept).not.toBe(draftPage);
    expect(kept.html).toContain("Keep this copy");
    // Nothing changed: the same built page.
    expect(await checkPageFor(t1)).toBe(kept);

    // Lab settings are on the page (its name, and the zone its dates are shown in).
    await labWrite(team.lab.id, (tx) =>
      updateLabSettings(tx, { labId: team.lab.id, patch: { name: "Renamed cache lab" }, actor: actor("manager") }),
    );
    const renamed = await served(t1);
    expect(renamed.html).toContain("Renamed cache lab");

    // A waiting draft of the chart is named on the page when it only rewords this copy; either
    // way the page is rebuilt.
    const second = await newEdition();
    const withDraft = await served(t1);
    expect(withDraft).not.toBe(renamed);

    // The stock changes under the chart: the copy is outdated.
    for (const i of [4, 5, 6])
      await deleteBalloon({ labId: team.lab.id, actorUserId: team.people.manager.id, balloonId: balloonIds[i]! });
    const outdated = await served(t1);
    expect(outdated.html).toContain("Outdated");

    // A newer approved edition.
    await withdrawEdition({ labId: team.lab.id, editionId: second.id, actor: actor("lead"), reason: "Stock changed" });
    const third = await newEdition();
    await approveEdition({ labId: team.lab.id, editionId: third.id, actor: actor("lead") });
    const superseded = await served(t1);
    expect(superseded.html).toContain("Superseded");
    const t3 = await tokenOf(third.id);
    const current = await served(t3);
    expect(current.html).toContain("Keep this copy");

    // The review-by date passes with nothing written: keep becomes review.
    const [row] = await db.select({ reviewBy: editions.reviewBy }).from(editions).where(eq(editions.id, third.id));
    expect(row!.reviewBy).not.toBeNull();
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date(row!.reviewBy!.getTime() + 60_000));
    const due = await served(t3);
    expect(due.html).toContain("Have this copy reviewed");
    vi.useRealTimers();
    expect((await served(t3)).html).toContain("Keep this copy");

    // Archiving the chart: every copy comes down.
    await labWrite(team.lab.id, (tx) =>
      setChartArchived(tx, { labId: team.lab.id, chartId, actor: actor("lead"), archive: true }),
    );
    const archived = await served(t3);
    expect(archived.html).toContain("Take this copy down");
  });

  it("an unknown token has no page", async () => {
    expect(await checkPageFor("x".repeat(24))).toBeNull();
  });
});
