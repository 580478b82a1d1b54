import type { AuditEntry } from "@/lib/ops/audit";
import { describeAction, describeDetail } from "@/lib/audit/describe";
import { formatShortCode } from "@/lib/editions/short-code";
import { formatDateTime } from "@/lib/format/dates";

/** What the event is about, in words: the chart, the edition (with its short code) and the room. */
function subject(e: AuditEntry): string | null {
  const parts: string[] = [];
  if (e.chart) parts.push(`"${e.chart.title}"`);
  if (e.edition)
    parts.push(`edition ${e.edition.number}${e.edition.shortCode ? ` (${formatShortCode(e.edition.shortCode)})` : ""}`);
  if (e.room) parts.push(`in ${e.room}`);
  return parts.length ? parts.join(", ") : null;
}

/** The lab's audit events; times in the lab's IANA time zone. */
export function AuditTable({
  events,
  timeZone,
  chartTitles = {},
}: {
  events: AuditEntry[];
  timeZone: string;
  chartTitles?: Record<number, string>;
}) {
  return (
    <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
      <table className="w-full min-w-[48rem] text-left text-sm">
        <caption className="sr-only">Audit log, newest first (times in {timeZone})</caption>
        <thead className="border-b border-line bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-4 py-2">
              When ({timeZone})
            </th>
            <th scope="col" className="px-4 py-2">
              Who
            </th>
            <th scope="col" className="px-4 py-2">
              What
            </th>
            <th scope="col" className="w-2/5 px-4 py-2">
              Detail
            </th>
          </tr>
        </thead>
        <tbody>
          {events.map((e) => {
            const lines = describeDetail(e.detail, { chartTitles });
            const about = subject(e);
            return (
              <tr key={e.id} className="border-b border-line align-top last:border-0" data-action={e.action}>
                <td className="whitespace-nowrap px-4 py-2 tabular-nums">
                  <time dateTime={e.createdAt.toISOString()}>{formatDateTime(e.createdAt, timeZone)}</time>
                </td>
                <td className="px-4 py-2">
                  {e.actorName ? (
                    <>
                      <span className="font-medium">{e.actorName}</span>
                      <span className="block break-words text-xs text-ink-faint">{e.actorEmail}</span>
                    </>
                  ) : (
                    <span className="text-ink-faint">not signed in</span>
                  )}
                </td>
                <td className="px-4 py-2">
                  {describeAction(e.action)}
                  {about ? (
                    <span className="block font-medium" data-testid="audit-subject">
                      {about}
                    </span>
                  ) : null}
                  {e.labId === null ? <span className="block text-xs text-ink-faint">account event</span> : null}
                </td>
                <td className="px-4 py-2">
                  {lines.length === 0 ? (
                    <span className="text-ink-faint">–</span>
                  ) : (
                    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
                      {lines.map((l, i) => (
                        <div key={i} className="contents">
                          <dt className="text-ink-faint">{l.label}</dt>
                          <dd className="break-words">
                            {l.value ?? (
                              <>
                                <span className="text-ink-soft">{l.before}</span> <span aria-label="changed to">→</span>{" "}
                                <strong>{l.after}</strong>
                              </>
                            )}
                          </dd>
                        </div>
                      ))}
                    </dl>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
