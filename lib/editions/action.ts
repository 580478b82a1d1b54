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

/** The check page's first heading: what to do with the copy, in a few words. */
export const ACTION_HEADINGS: Readonly<Record<CopyAction, string>> = {
  keep: "Keep this copy",
  replace: "Replace this copy",
  "take-down": "Take this copy down",
  review: "Have this copy reviewed",
};

/** Whom to ask, from the lab's contact line (settings); the line may already start with "ask". */
export function askWho(contactLine: string | null): string {
  const who = contactLine?.trim().replace(/[.\s]+$/, "") || "the lab's manager";
  return /^ask\b/i.test(who) ? who : `ask ${who}`;
}

/**
 * The one sentence under the heading: why, and the one person to ask when someone must act.
 * With `timeZone`, dates read 2026-12-02 in it.
 */
export function actionSentence(
  action: CopyAction,
  v: {
    reviewBy: Date | null;
    replacement: { number: number; approvedAt?: Date | null } | null;
    timeZone?: string;
    contactLine?: string | null;
  },
): string {
  const day = (d: Date) =>
    v.timeZone
      ? formatDate(d, v.timeZone)
      : d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
  const ask = askWho(v.contactLine ?? null);
  switch (action) {
    case "keep":
      return v.reviewBy
        ? `It matches the lab's stock and rules today; review due by ${day(v.reviewBy)}.`
        : "It matches the lab's stock and rules today.";
    case "replace": {
      const approved = v.replacement?.approvedAt ? ` (approved ${day(v.replacement.approvedAt)})` : "";
      return `Put up edition ${v.replacement?.number ?? "the current edition"}${approved}, the lab's current approved edition, in its place.`;
    }
    case "take-down":
      return `No approved replacement yet: ${ask}.`;
    case "review":
      return `Its review date (${v.reviewBy ? day(v.reviewBy) : "an earlier date"}) has passed: ${ask} to review the chart before relying on it.`;
  }
}
