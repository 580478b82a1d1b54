// The e-mail a lab's managers (and educators who opted in) get when posted copies go stale.
// Pure: built from the stored notice, so a retry sends the very same message.
import type { StaleItem, StaleNotice } from "@/lib/editions/stale";

export type { StaleItem, StaleNotice };

const WHAT: Record<StaleItem["status"], string> = {
  outdated: "outdated (the stock or settings changed after approval)",
  superseded: "superseded by a newer approved edition",
  withdrawn: "withdrawn",
};

export function staleNoticeMail(notice: StaleNotice, appUrl: string): { subject: string; text: string } {
  const n = notice.items.length;
  const rooms = [...new Set(notice.items.map((i) => i.room))];
  const subject = `Forkwall: ${n} wall printout${n > 1 ? "s" : ""} to replace in ${notice.labName}`;
  const lines = [
    `A change in ${notice.labName} made printed charts on the wall stale:`,
    `  ${notice.cause}`,
    "",
    `Rooms to visit: ${rooms.join(", ")}`,
    "",
  ];
  for (const item of notice.items) {
    lines.push(`- ${item.room}: "${item.chartTitle}", edition ${item.editionNumber}, is ${WHAT[item.status]}.`);
    for (const c of item.changes.slice(0, 5)) lines.push(`    ${c}`);
    if (item.current)
      lines.push(`    Print edition ${item.current.number}: ${appUrl}/api/v1/editions/${item.current.editionId}/pdf`);
    else
      lines.push(
        `    No approved edition matches yet: create and approve a new edition at ${appUrl}/labs/${notice.labSlug}/charts/${item.chartId}`,
      );
  }
  lines.push(
    "",
    `Room board: ${appUrl}/labs/${notice.labSlug}/rooms`,
    "",
    "Replace the printouts and record them from their check pages. Reference aid only; local protocol and licensed practice rule.",
  );
  return { subject, text: lines.join("\n") };
}
