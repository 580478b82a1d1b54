// What a change would do to the wall: the copies that would turn outdated, by chart edition.
import { count, list } from "@/lib/format/plural";

export type Outdate = { chartId: number; title: string; editionId: number; copies: number; rooms: string[] };

type Copy = {
  postingId: number;
  room: string;
  status: string;
  chart: { id: number; title: string };
  edition: { id: number };
};

/** Copies outdated after the change that were not before, grouped by edition, rooms in name order. */
export function outdatesOf(before: readonly Copy[], after: readonly Copy[]): Outdate[] {
  const was = new Map(before.map((c) => [c.postingId, c.status]));
  const byEdition = new Map<number, Outdate>();
  for (const copy of after) {
    if (copy.status !== "outdated" || was.get(copy.postingId) === "outdated") continue;
    const entry = byEdition.get(copy.edition.id) ?? {
      chartId: copy.chart.id,
      title: copy.chart.title,
      editionId: copy.edition.id,
      copies: 0,
      rooms: [],
    };
    entry.copies += 1;
    if (!entry.rooms.includes(copy.room)) entry.rooms.push(copy.room);
    byEdition.set(copy.edition.id, entry);
  }
  return [...byEdition.values()]
    .map((o) => ({ ...o, rooms: [...o.rooms].sort((a, b) => a.localeCompare(b)) }))
    .sort((a, b) => a.title.localeCompare(b.title) || a.editionId - b.editionId);
}

/** "This change makes 3 posted copies of 2 charts outdated, in Room 1 and Room 2." */
export function impactSentence(outdates: readonly Outdate[]): string {
  const copies = outdates.reduce((n, o) => n + o.copies, 0);
  if (copies === 0) return "This change makes no posted copy outdated.";
  const charts = new Set(outdates.map((o) => o.chartId)).size;
  const rooms = [...new Set(outdates.flatMap((o) => o.rooms))].sort((a, b) => a.localeCompare(b));
  return `This change makes ${count(copies, { one: "posted copy", other: "posted copies" })} of ${count(charts, { one: "chart", other: "charts" })} outdated, in ${list(rooms)}.`;
}
