import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { describeStockChange, STOCK_ACTION_LABELS } from "@/lib/stock/history";
import { formatDateTime } from "@/lib/format/dates";

export type StockHistoryEvent = {
  id: number;
  action: string;
  detail: unknown;
  createdAt: Date;
  actorName: string | null;
};

// A big import can touch thousands of sizes; the page lists the first of them.
const ROWS_SHOWN = 200;

const summaryOf = (detail: unknown) =>
  typeof detail === "object" && detail && "summary" in detail ? String((detail as { summary: unknown }).summary) : "";
const revisionOf = (detail: unknown) =>
  typeof detail === "object" && detail && "revision" in detail
    ? Number((detail as { revision: unknown }).revision)
    : null;

/** Stock changes newest first, each with its before and after. */
export function StockHistory({
  slug,
  events,
  olderCursor,
  timeZone,
}: {
  slug: string;
  events: StockHistoryEvent[];
  olderCursor: number | null;
  /** The lab's IANA time zone: times are shown in it. */
  timeZone: string;
}) {
  const when = (d: Date) => formatDateTime(d, timeZone);
  return (
    <section aria-labelledby="stock-history-heading" className="space-y-3">
      <div>
        <h2 id="stock-history-heading" className="text-xl font-semibold">
          Stock history
        </h2>
        <p className="text-sm text-ink-soft">
          Every change to this lab&apos;s stock, newest first: who made it, and what it was before and after.
        </p>
      </div>
      {events.length === 0 ? (
        <EmptyState title="No stock changes recorded yet">
          Changes made here or by CSV import appear in this list.
        </EmptyState>
      ) : (
        <ol
          className="divide-y divide-line rounded-card border border-line bg-paper-raised"
          data-testid="stock-history"
        >
          {events.map((event) => {
            const rows = describeStockChange(event.action, event.detail);
            const revision = revisionOf(event.detail);
            return (
              <li key={event.id} className="px-4 py-3">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <p>
                    <span className="font-semibold">{STOCK_ACTION_LABELS[event.action] ?? event.action}</span>
                    <span className="text-ink-soft">: {summaryOf(event.detail)}</span>
                  </p>
                  <p className="text-xs text-ink-faint">
                    <time dateTime={event.createdAt.toISOString()}>{when(event.createdAt)}</time> ·{" "}
                    {event.actorName ?? "a removed account"}
                    {revision !== null ? ` · revision ${revision}` : ""}
                  </p>
                </div>
                {rows.length ? (
                  <details className="mt-1 text-sm">
                    <summary className="cursor-pointer text-brand-700">Before and after ({rows.length})</summary>
                    <div className="relative mt-2 max-h-80 overflow-auto">
                      <table className="w-full text-left">
                        <caption className="sr-only">Before and after</caption>
                        <thead className="text-ink-soft">
                          <tr>
                            <th scope="col" className="py-1 pr-4 font-semibold">
                              What
                            </th>
                            <th scope="col" className="py-1 pr-4 font-semibold">
                              Before
                            </th>
                            <th scope="col" className="py-1 font-semibold">
                              After
                            </th>
                          </tr>
                        </thead>
                        <tbody>
                          {rows.slice(0, ROWS_SHOWN).map((r, i) => (
                            <tr key={i} className="border-t border-line align-top">
                              <th scope="row" className="py-1 pr-4 font-normal">
                                {r.label}
                              </th>
                              <td className="py-1 pr-4">{r.before}</td>
                              <td className="py-1">{r.after}</td>
                            </tr>
                          ))}
                        </tbody>
                      </table>
                      {rows.length > ROWS_SHOWN ? (
                        <p className="mt-1 text-ink-faint">
                          and {rows.length - ROWS_SHOWN} more changes not listed here.
                        </p>
                      ) : null}
                    </div>
                  </details>
                ) : null}
              </li>
            );
          })}
        </ol>
      )}
      {olderCursor ? (
        <Link
          href={`/labs/${slug}/stock?before=${olderCursor}#stock-history-heading`}
          className="inline-block text-brand-700 underline"
        >
          Show older changes
        </Link>
      ) : null}
    </section>
  );
}
