import { describe, expect, it } from "vitest";
import { count, list, noun, withArticle } from "@/lib/format/plural";
import { impactSentence, outdatesOf } from "@/lib/stock/impact";

describe("counted words", () => {
  it("follows English plural rules for 0, 1, 2 and fractions", () => {
    const sizes = { one: "size", other: "sizes" };
    expect(count(1, sizes)).toBe("1 size");
    expect(count(2, sizes)).toBe("2 sizes");
    expect(count(0, sizes)).toBe("0 sizes");
    expect(count(0, sizes, "no sizes")).toBe("no sizes");
    expect(count(1.5, sizes)).toBe("1.5 sizes");
    expect(noun(1, sizes)).toBe("size");
  });

  it("joins lists and puts the right article before a role", () => {
    expect(list(["Room 1"])).toBe("Room 1");
    expect(list(["Room 1", "Room 2"])).toBe("Room 1 and Room 2");
    expect(list(["A", "B", "C"])).toBe("A, B, and C");
    expect(withArticle("medical lead")).toBe("a medical lead");
    expect(withArticle("educator")).toBe("an educator");
  });
});

describe("impact of a change on the wall", () => {
  const copy = (postingId: number, status: string, room: string, chart = 1, edition = 10) => ({
    postingId,
    status,
    room,
    chart: { id: chart, title: `Chart ${chart}` },
    edition: { id: edition },
  });

  it("counts only copies that newly turn outdated, by edition, rooms sorted", () => {
    const before = [copy(1, "current", "Room 2"), copy(2, "current", "Room 1"), copy(3, "outdated", "Room 3")];
    const after = [
      copy(1, "outdated", "Room 2"),
      copy(2, "outdated", "Room 1"),
      copy(3, "outdated", "Room 3"),
      copy(4, "outdated", "Room 1", 2, 20), // a copy that was not there before counts too
    ];
    const outdates = outdatesOf(before, after);
    expect(outdates).toEqual([
      { chartId: 1, title: "Chart 1", editionId: 10, copies: 2, rooms: ["Room 1", "Room 2"] },
      { chartId: 2, title: "Chart 2", editionId: 20, copies: 1, rooms: ["Room 1"] },
    ]);
    expect(impactSentence(outdates)).toBe(
      "This change makes 3 posted copies of 2 charts outdated, in Room 1 and Room 2.",
    );
    expect(impactSentence(outdatesOf(before, before))).toBe("This change makes no posted copy outdated.");
    expect(impactSentence([outdates[1]!])).toBe("This change makes 1 posted copy of 1 chart outdated, in Room 1.");
  });
});
