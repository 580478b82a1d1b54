import { describe, expect, it } from "vitest";
import { describeAction, describeDetail } from "@/lib/audit/describe";

describe("audit log wording", () => {
  it("names known actions and keeps unknown ones readable", () => {
    expect(describeAction("member.role_changed")).toBe("Changed a member's role");
    expect(describeAction("stock.balloon_added")).toBe("stock balloon added");
  });

  it("shows role changes as before -> after with role names", () => {
    expect(describeDetail({ member: "a@x.test", before: { role: "educator" }, after: { role: "operator" } })).toEqual([
      { label: "Member", value: "a@x.test" },
      { label: "Role", before: "Educator", after: "Operator" },
    ]);
  });

  it("marks removals and copes with empty or odd detail", () => {
    expect(describeDetail({ before: { role: "lead" }, after: null })).toEqual([
      { label: "Role", before: "Medical lead", after: "removed" },
    ]);
    expect(describeDetail(null)).toEqual([]);
    expect(describeDetail([1, 2])).toEqual([{ label: "Detail", value: "1, 2" }]);
    expect(describeDetail({ expiresAt: "2026-01-02T03:04:05.000Z", newAccount: true })).toEqual([
      { label: "Link expires", value: "2026-01-02 03:04 UTC" },
      { label: "New account", value: "yes" },
    ]);
  });
});

describe("audit log wording for charts, stock, downloads and rules", () => {
  it("labels every action a person can take, downloads as downloads", () => {
    expect(describeAction("edition.printed")).toBe("Downloaded an edition's PDF");
    expect(describeAction("edition.downloaded")).toBe("Downloaded an edition's PDF");
    expect(describeAction("stock.balloon.update")).toBe("Changed a balloon size");
    expect(describeAction("stock.platform.delete")).toBe("Removed a stent platform");
    expect(describeAction("lab.rules_updated")).toBe("Changed the lab rules");
    for (const a of ["chart.created", "chart.updated", "edition.approved", "edition.rejected", "posting.created"])
      expect(describeAction(a)).not.toMatch(/[._]/);
  });

  it("shows only the fields that changed, with human labels and values in words", () => {
    const def = {
      title: "POT chart",
      law: { law: "finet", ratio: 0.678 },
      lookups: [
        { kind: "proximal", rows: { from: 2.5, to: 3.5, step: 0.25 }, cols: [2, 2.5], rounding: "up", familyId: 3 },
      ],
      paper: "A2",
      orientation: "portrait",
      readingDistanceM: 1.5,
      notes: "",
      roundingCaps: { upMm: 0.25, downMm: 0.5 },
    };
    const lines = describeDetail({
      before: def,
      after: { ...def, law: { law: "murray" }, readingDistanceM: 2, roundingCaps: { upMm: 0.25, downMm: 0.25 } },
    });
    expect(lines).toEqual([
      { label: "Law", before: "Finet (ratio 0.678)", after: "Murray" },
      { label: "Reading distance", before: "1.5 m", after: "2 m" },
      { label: "Rounding caps", before: "0.25 mm above, 0.5 mm below", after: "0.25 mm above, 0.25 mm below" },
    ]);
    const all = JSON.stringify(lines);
    expect(all).not.toMatch(/readingDistanceM|roundingCaps|\{"law"/);
  });

  it("hides bookkeeping, names stock values with units, and opens nested rule changes", () => {
    expect(
      describeDetail({
        summary: "Marked NC A 3.75 mm out of stock",
        revision: 4,
        before: { inStock: true, diameterMm: 3.75 },
        after: { inStock: false, diameterMm: 3.75 },
      }),
    ).toEqual([
      { label: "Change", value: "Marked NC A 3.75 mm out of stock" },
      { label: "In stock", before: "yes", after: "no" },
    ]);
    expect(describeDetail({ number: 2, status: "approved", cached: true })).toEqual([
      { label: "Edition", value: "2" },
      { label: "Status", value: "approved" },
    ]);
    const rules = describeDetail(
      {
        revision: 3,
        before: {
          lookups: { proximal: { laws: ["finet", "murray"], rounding: ["up"] } },
          exceptions: [],
        },
        after: {
          lookups: { proximal: { laws: ["finet"], rounding: ["up"] } },
          exceptions: [{ chartId: 9, rule: "law", reason: "Teaching chart" }],
        },
      },
      { chartTitles: { 9: "Kissing chart" } },
    );
    expect(rules).toEqual([
      { label: "Lookups › POT (proximal) lookup › Laws allowed", before: "Finet, Murray", after: "Finet" },
      { label: "Exceptions", before: "none", after: 'Laws allowed for "Kissing chart": Teaching chart' },
    ]);
  });
});
