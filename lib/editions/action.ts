import { formatDate } from "@/lib/format/dates";
import type { CheckStatus } from "./check";

/** What to do with a printed copy, in one word: the answer a person at the wall needs. */
export const COPY_ACTIONS = ["keep", "replace", "take-down", "review"] as const;
export type CopyAction = (typeof COPY_ACTIONS)[number];

export type ActionInput = {
  /** The copy's status (lib/editions/check.ts). */
  status: CheckStatus;
  /** The copy's review-by date (set at approval), or null when it has none. */
  reviewBy: Date | null;
  /**
   * The chart's approved edition other than this copy, and whether it matches what the chart
   * prints today; null when the chart has none.
   */
  replacement: { number: number; matchesToday: boolean } | null;
  now: Date;
};

/**
 * The rules: a current copy is kept until its review-by date passes (then `review`, or `replace`
 * when a newer approved edition that only rewords it matches today's chart). Any other
 * copy (outdated, superseded, withdrawn, a draft) is replaced when an approved edition that
 * still matches today's chart exists, and otherwise taken down: no approved edition can replace
 * it, and numbers that no longer match the stock must not hang on the wall.
 */
export function copyAction({ status, reviewBy, replacement, now }: ActionInput): CopyAction {
  if (status === "current") {
    if (!reviewBy || reviewBy.getTime() > now.getTime()) return "keep";
    // A copy kept current past a reworded edition is replaced by it once its own review date passes.
    return replacement?.matchesToday ? "replace" : "review";
  }
  if (replacement?.matchesToday) return "replace";
  return "take-down";
}

/** The one sentence the check page shows for the action; with `timeZone`, dates read 2026-12-02 in it. */
export function actionSentence(
  action: CopyAction,
  v: { reviewBy: Date | null; replacement: { number: number } | null; timeZone?: string },
): string {
  const day = (d: Date) =>
    v.timeZone
      ? formatDate(d, v.timeZone)
      : d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
  switch (action) {
    case "keep":
      return v.reviewBy
        ? `Keep this printout on the wall: it matches the lab's stock and rules today and is due for review by ${day(v.reviewBy)}.`
        : "Keep this printout on the wall: it matches the lab's stock and rules today.";
    case "replace":
      return `Replace this printout with edition ${v.replacement?.number ?? "the current edition"}, the lab's current approved edition, and discard this copy.`;
    case "take-down":
      return "Take this printout down: no approved edition replaces it yet, so ask the lab's medical lead or manager for one.";
    case "review":
      return `This printout was due for review by ${v.reviewBy ? day(v.reviewBy) : "an earlier date"}: ask the lab's medical lead to review the chart before relying on it.`;
  }
}
