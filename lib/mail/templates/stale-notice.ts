// The e-mails a lab's managers (and educators who opted in) get about printed copies on the
// wall: one digest per quiet period naming the rooms and copies to replace, and an all-clear once
// every copy is current again. Pure: built from stored notices and the copies' statuses.
import { quotedLabName } from "../templates";
import type { StaleItem, StaleNotice } from "@/lib/editions/stale";

export type { StaleItem, StaleNotice };

const WHAT: Record<StaleItem["status"], string> = {
  outdated: "outdated (the stock or settings changed after approval)",
  superseded: "superseded by a newer approved edition",
  withdrawn: "withdrawn",
};

const CLOSING = "Reference aid only; local protocol and licensed practice rule.";

export type Digest = {
  labName: string;
  labSlug: string;
  /** What happened since the last e-mail, oldest first. */
  causes: string[];
  /** The copies stale now (a digest); empty for an all-clear. */
  items: StaleItem[];
};

const causeLines = (causes: string[]) => {
  const unique = [...new Set(causes)];
  const shown = unique.slice(0, 10).map((c) => `  - ${c}`);
  if (unique.length > shown.length)
    shown.push(`  - and ${unique.length - shown.length} more changes (see the audit log)`);
  return shown;
};

/** The copies to replace, room by room, each with what changed and what to print instead. */
export function staleDigestMail(digest: Digest, appUrl: string): { subject: string; text: string } {
  const n = digest.items.length;
  const rooms = [...new Set(digest.items.map((i) => i.room))].sort((a, b) =>
    a.localeCompare(b, "en", { numeric: true }),
  );
  const subject = `Forkwall: ${n} wall printout${n > 1 ? "s" : ""} to replace in ${quotedLabName(digest.labName)}`;
  const lines = [
    `Printed charts on the wall in ${quotedLabName(digest.labName)} no longer match what is approved and must be replaced.`,
    "",
    "What changed:",
    ...causeLines(digest.causes),
    "",
    `Rooms to visit: ${rooms.join(", ")}`,
  ];
  for (const room of rooms) {
    lines.push("", `${room}:`);
    for (const item of digest.items.filter((i) => i.room === room)) {
      lines.push(`- "${item.chartTitle}", edition ${item.editionNumber}, is ${WHAT[item.status]}.`);
      for (const c of item.changes.slice(0, 5)) lines.push(`    ${c}`);
      if (item.current)
        lines.push(`    Print edition ${item.current.number}: ${appUrl}/api/v1/editions/${item.current.editionId}/pdf`);
      else
        lines.push(
          `    No approved edition matches yet: create and approve a new edition at ${appUrl}/labs/${digest.labSlug}/charts/${item.chartId}`,
        );
    }
  }
  lines.push(
    "",
    `Room board: ${appUrl}/labs/${digest.labSlug}/rooms`,
    "",
    `Replace the printouts and record them from their check pages. ${CLOSING}`,
  );
  return { subject, text: lines.join("\n") };
}

/** Every copy on the wall matches its approved edition again. */
export function allClearMail(digest: Digest, appUrl: string): { subject: string; text: string } {
  return {
    subject: `Forkwall: every wall printout in ${quotedLabName(digest.labName)} is current again`,
    text: [
      `Every printed chart on the wall in ${quotedLabName(digest.labName)} matches its approved edition again; nothing needs replacing now.`,
      "",
      "What changed:",
      ...causeLines(digest.causes),
      "",
      `Room board: ${appUrl}/labs/${digest.labSlug}/rooms`,
      "",
      CLOSING,
    ].join("\n"),
  };
}

/** One stored notice as a digest of its own (the shape before digests; kept for its callers). */
export function staleNoticeMail(notice: StaleNotice, appUrl: string): { subject: string; text: string } {
  return staleDigestMail({ ...notice, causes: [notice.cause] }, appUrl);
}
