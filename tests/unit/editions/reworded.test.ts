import { describe, expect, it } from "vitest";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import type { Snapshot } from "@/lib/charts/snapshot";
import { copyAction } from "@/lib/editions/action";
import { checkEdition, type CheckEdition } from "@/lib/editions/check";
import { checkJson, rewordedSentence } from "@/lib/editions/check-json";
import { potDefinition, snapshotOf } from "../../support/poster-fixtures";

const base = snapshotOf(potDefinition);
const reworded: Snapshot = { ...base, notes: "New words", title: "A new title", logoSha256: "cd".repeat(32) };
const liveOf = (s: Snapshot) => ({ liveFingerprint: fingerprintOf(s), liveSnapshot: s });
const edition = (over: Partial<CheckEdition> = {}): CheckEdition => ({
  id: 1,
  chartId: 1,
  number: 1,
  status: "approved",
  snapshot: base,
  fingerprint: fingerprintOf(base),
  approvedAt: new Date("2026-11-02T10:00:00Z"),
  supersededAt: null,
  withdrawnAt: null,
  ...over,
});
const clinicalChange: Snapshot = {
  ...base,
  lookups: base.lookups.map((l) => ({ ...l, family: l.family && { ...l.family, rbpAtm: l.family.rbpAtm + 2 } })),
};

describe("wording-only changes", () => {
  it("a notes, title or logo change leaves an approved copy current, with no reworded edition yet", () => {
    const r = checkEdition(edition(), liveOf(reworded), null);
    expect(r).toEqual({ status: "current", changes: [] });
    expect(r.reworded).toBeUndefined();
  });

  it("names a waiting reworded draft", () => {
    const draft = { number: 2, fingerprint: fingerprintOf(reworded), snapshot: reworded };
    expect(checkEdition(edition(), liveOf(reworded), null, draft)).toEqual({
      status: "current",
      changes: [],
      reworded: { number: 2, status: "draft" },
    });
  });

  it("a copy superseded by an edition that only rewords it stays current, and the action is keep", () => {
    const sup = edition({ status: "superseded", supersededAt: new Date("2026-11-20T00:00:00Z") });
    const r = checkEdition(sup, liveOf(reworded), { number: 2, approvedAt: new Date(), snapshot: reworded });
    expect(r).toEqual({ status: "current", changes: [], reworded: { number: 2, status: "approved" } });
    expect(copyAction({ status: r.status, reviewBy: null, replacement: null, now: new Date() })).toBe("keep");
    const json = checkJson({
      status: r.status,
      action: "keep",
      reviewBy: null,
      since: null,
      edition: { number: 1, approvedAt: null },
      chart: { title: "t" },
      lab: { name: "l" },
      changes: [],
      currentEdition: null,
      reworded: r.reworded,
    });
    expect(json).toMatchObject({ reworded: true, rewordedEdition: { number: 2, status: "approved" } });
    expect(rewordedSentence(r.reworded!)).toMatch(/reworded edition is available \(edition 2\)/);
  });

  it("a new badge card choice is wording too: the copy stays current and names the edition that carries it", () => {
    const carded: Snapshot = {
      ...base,
      card: {
        sides: [
          { lookup: 0, rows: [3, 3.5] },
          { lookup: 0, cols: [2.5, 3] },
        ],
      },
    };
    expect(checkEdition(edition(), liveOf(carded), null)).toEqual({ status: "current", changes: [] });
    const draft = { number: 2, fingerprint: fingerprintOf(carded), snapshot: carded };
    expect(checkEdition(edition(), liveOf(carded), null, draft).reworded).toEqual({ number: 2, status: "draft" });
    const sup = edition({ status: "superseded", supersededAt: new Date("2026-11-20T00:00:00Z") });
    expect(checkEdition(sup, liveOf(carded), { number: 2, approvedAt: new Date(), snapshot: carded })).toEqual({
      status: "current",
      changes: [],
      reworded: { number: 2, status: "approved" },
    });
    // The card choice rides along with a clinical change but does not hide it.
    const both: Snapshot = { ...clinicalChange, card: carded.card! };
    const r = checkEdition(edition(), liveOf(both), null);
    expect(r.status).toBe("outdated");
    expect(r.changes.map((c) => c.detail)).toContain("The badge card's sides changed");
  });

  it("a clinical change still makes copies outdated, and a superseding clinical change supersedes", () => {
    expect(checkEdition(edition(), liveOf(clinicalChange), null).status).toBe("outdated");
    const sup = edition({ status: "superseded", supersededAt: new Date("2026-11-20T00:00:00Z") });
    expect(
      checkEdition(sup, liveOf(clinicalChange), { number: 2, approvedAt: new Date(), snapshot: clinicalChange }).status,
    ).toBe("superseded");
    // Reworded successor, but the stock moved on since: not current.
    expect(
      checkEdition(sup, liveOf(clinicalChange), { number: 2, approvedAt: new Date(), snapshot: reworded }).status,
    ).toBe("superseded");
  });
});
