import { describe, expect, it } from "vitest";
import { ACTION_HEADINGS, actionSentence, askWho, copyAction, type CopyAction } from "@/lib/editions/action";
import type { CheckStatus } from "@/lib/editions/check";

const now = new Date("2026-06-15T12:00:00Z");
const REVIEW = {
  none: null,
  future: new Date("2026-06-16T00:00:00Z"),
  exactlyNow: now,
  past: new Date("2026-06-14T00:00:00Z"),
} as const;
const REPLACEMENT = {
  none: null,
  matching: { number: 4, matchesToday: true },
  stale: { number: 4, matchesToday: false },
} as const;

// The table written out by hand, one row per status: [replacement][review] -> action.
const EXPECTED: Record<CheckStatus, Record<keyof typeof REPLACEMENT, Record<keyof typeof REVIEW, CopyAction>>> = {
  current: {
    none: { none: "keep", future: "keep", exactlyNow: "review", past: "review" },
    // Only a copy kept current past a reworded edition has a replacement: once due, replace it.
    matching: { none: "keep", future: "keep", exactlyNow: "replace", past: "replace" },
    stale: { none: "keep", future: "keep", exactlyNow: "review", past: "review" },
  },
  outdated: {
    none: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
    matching: { none: "replace", future: "replace", exactlyNow: "replace", past: "replace" },
    stale: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
  },
  superseded: {
    none: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
    matching: { none: "replace", future: "replace", exactlyNow: "replace", past: "replace" },
    stale: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
  },
  withdrawn: {
    none: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
    matching: { none: "replace", future: "replace", exactlyNow: "replace", past: "replace" },
    stale: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
  },
  draft: {
    none: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
    matching: { none: "replace", future: "replace", exactlyNow: "replace", past: "replace" },
    stale: { none: "take-down", future: "take-down", exactlyNow: "take-down", past: "take-down" },
  },
};

describe("what a status means for the copy on the wall", () => {
  for (const [status, byReplacement] of Object.entries(EXPECTED))
    for (const [rep, byReview] of Object.entries(byReplacement))
      for (const [review, action] of Object.entries(byReview))
        it(`${status}, replacement ${rep}, review-by ${review}: ${action}`, () => {
          expect(
            copyAction({
              status: status as CheckStatus,
              replacement: REPLACEMENT[rep as keyof typeof REPLACEMENT],
              reviewBy: REVIEW[review as keyof typeof REVIEW],
              now,
            }),
          ).toBe(action);
        });

  it("heads the page with the action in a few words", () => {
    expect(ACTION_HEADINGS).toEqual({
      keep: "Keep this copy",
      replace: "Replace this copy",
      "take-down": "Take this copy down",
      review: "Have this copy reviewed",
    });
  });

  it("says one sentence per action, naming the replacement, the review date and one person to ask", () => {
    expect(actionSentence("replace", { reviewBy: null, replacement: { number: 7 } })).toMatch(/edition 7/);
    expect(actionSentence("take-down", { reviewBy: null, replacement: null })).toBe(
      "No approved replacement yet: ask the lab's manager.",
    );
    expect(actionSentence("review", { reviewBy: REVIEW.past, replacement: null })).toMatch(
      /14 June 2026.*ask the lab's manager to review/,
    );
    expect(actionSentence("keep", { reviewBy: REVIEW.future, replacement: null })).toMatch(/16 June 2026/);
    for (const s of [
      actionSentence("keep", { reviewBy: REVIEW.future, replacement: null }),
      actionSentence("replace", { reviewBy: null, replacement: { number: 2, approvedAt: REVIEW.past } }),
      actionSentence("take-down", { reviewBy: null, replacement: null }),
      actionSentence("review", { reviewBy: REVIEW.past, replacement: null }),
    ])
      expect(s.match(/[.!?](\s|$)/g)?.length, s).toBe(1);
  });

  it("asks the person the lab's settings name, whether or not the line starts with ask", () => {
    const v = { reviewBy: REVIEW.past, replacement: null };
    expect(actionSentence("take-down", { ...v, contactLine: "the charge nurse." })).toBe(
      "No approved replacement yet: ask the charge nurse.",
    );
    expect(actionSentence("review", { ...v, contactLine: "Ask the charge nurse in room 2" })).toMatch(
      /: Ask the charge nurse in room 2 to review/,
    );
    expect(askWho("   ")).toBe("ask the lab's manager");
  });
});
