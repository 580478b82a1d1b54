import { describe, expect, it } from "vitest";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot, type LabStock } from "@/lib/charts/snapshot";
import { checkView, replacementOf, statusSince, type CheckRows } from "@/lib/editions/verdict";
import { chartDefinitionSchema } from "@/lib/validation/chart";

// Invented, illustrative stock for the tests only.
const stock = (out: number[] = []): LabStock => ({
  balloonFamilies: [
    {
      id: 1,
      name: "NC test family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: null,
      balloons: [2, 2.5, 3, 3.25, 3.5, 3.75, 4, 4.5].map((d) => ({ diameterMm: d, inStock: !out.includes(d) })),
    },
  ],
  stentPlatforms: [],
});
const definition = (title = "Kissing chart") =>
  chartDefinitionSchema.parse({
    title,
    law: { law: "square" },
    lookups: [
      {
        kind: "side",
        rows: { from: 3, to: 4, step: 0.25 },
        cols: { from: 2.5, to: 3.5, step: 0.25 },
        rounding: "down",
        familyId: 1,
      },
    ],
    paper: "TABLOID",
    orientation: "landscape",
    readingDistanceM: 2,
  });
const snap = (out: number[] = [], title?: string) =>
  buildSnapshot({ labName: "Test lab", definition: definition(title), stock: stock(out), logoSha256: null });

const d = (s: string) => new Date(`${s}T09:00:00Z`);
const now = d("2026-12-01");

type Over = {
  edition?: Partial<CheckRows["edition"]>;
  chart?: Partial<CheckRows["chart"]>;
  current?: CheckRows["current"];
  draft?: CheckRows["draft"];
};

function rows(over: Over = {}): CheckRows {
  const printed = snap();
  return {
    edition: {
      id: 10,
      chartId: 1,
      number: 3,
      status: "approved",
      snapshot: printed,
      fingerprint: fingerprintOf(printed),
      shortCode: "K7QM2XHD",
      createdAt: d("2026-10-01"),
      approvedAt: d("2026-10-02"),
      supersededAt: null,
      withdrawnAt: null,
      reviewBy: d("2027-10-02"),
      ...over.edition,
    },
    chart: {
      id: 1,
      title: "Kissing chart",
      liveFingerprint: fingerprintOf(printed),
      liveSnapshot: printed,
      liveChangedAt: d("2026-10-01"),
      archivedAt: null,
      ...over.chart,
    },
    lab: {
      id: 1,
      slug: "t",
      name: "Test lab",
      isDemo: false,
      timeZone: "UTC",
      numberFormat: "point",
      contactLine: null,
    },
    current: over.current ?? null,
    draft: over.draft ?? null,
  };
}

const approved = (out: number[], number = 4) => {
  const s = snap(out);
  return { id: 11, number, approvedAt: d("2026-11-20"), fingerprint: fingerprintOf(s), snapshot: s };
};

describe("the check's verdict from the rows read for one copy", () => {
  it("keeps a copy that matches today's chart until its review date", () => {
    const v = checkView(rows(), now);
    expect([v.status, v.action, v.since]).toEqual(["current", "keep", d("2026-10-02")]);
    expect(checkView(rows({ edition: { reviewBy: d("2026-11-30") } }), now).action).toBe("review");
  });

  it("takes down an outdated copy nothing approved replaces, dated from the stock change", () => {
    const live = snap([2.5]);
    const v = checkView(
      rows({ chart: { liveSnapshot: live, liveFingerprint: fingerprintOf(live), liveChangedAt: d("2026-11-25") } }),
      now,
    );
    expect([v.status, v.action, v.since, v.currentEdition]).toEqual(["outdated", "take-down", d("2026-11-25"), null]);
    expect(v.snapshots.live).toBe(live);
  });

  it("replaces a superseded copy with the approved edition that matches today", () => {
    const next = approved([2.5]);
    const v = checkView(
      rows({
        edition: { status: "superseded", supersededAt: d("2026-11-20") },
        chart: { liveSnapshot: next.snapshot, liveFingerprint: next.fingerprint },
        current: next,
      }),
      now,
    );
    expect([v.status, v.action, v.since]).toEqual(["superseded", "replace", d("2026-11-20")]);
    expect(v.currentEdition).toEqual({ id: 11, number: 4, approvedAt: d("2026-11-20") });
    expect(v.snapshots.current).toBe(next.snapshot);
  });

  it("a replacement that only rewords today's chart still matches it", () => {
    const live = snap([], "Renamed chart");
    const next = approved([]);
    expect(
      replacementOf({
        chart: { ...rows().chart, liveSnapshot: live, liveFingerprint: fingerprintOf(live) },
        current: next,
      })?.matchesToday,
    ).toBe(true);
    expect(replacementOf({ chart: rows().chart, current: approved([2.5]) })?.matchesToday).toBe(false);
  });

  it("an archived chart offers no replacement: its copies read withdrawn and come down", () => {
    const next = approved([]);
    const v = checkView(rows({ chart: { archivedAt: d("2026-11-28") }, current: next }), now);
    expect([v.status, v.action, v.since, v.currentEdition]).toEqual(["withdrawn", "take-down", d("2026-11-28"), null]);
    expect(v.snapshots.current).toBeNull();
  });

  it("a draft's copy is dated from its creation and replaced by the approved edition", () => {
    const v = checkView(rows({ edition: { status: "draft", approvedAt: null }, current: approved([]) }), now);
    expect([v.status, v.action, v.since]).toEqual(["draft", "replace", d("2026-10-01")]);
  });

  it("dates a withdrawal by the edition's own date before the chart's archive date", () => {
    const r = rows({
      edition: { status: "withdrawn", withdrawnAt: d("2026-11-02") },
      chart: { archivedAt: d("2026-11-03") },
    });
    expect(statusSince("withdrawn", r)).toEqual(d("2026-11-02"));
  });
});
