import type { CSSProperties } from "react";
import type { PrintItem } from "@/lib/editions/prints";
import { PALETTE } from "@/lib/poster/marks";

// Changed like a changed cell: heavy dashed outline and ◆, with the word for screen readers.
const CHANGED: CSSProperties = { outline: `3px dashed ${PALETTE.ink}`, outlineOffset: "-3px" };

/** Everything the edition's poster prints besides the cells, item by item, and the PDF itself. */
export function EditionPrints({
  items,
  pdfUrl,
  rendererVersion,
  againstNumber,
}: {
  items: PrintItem[];
  pdfUrl: string;
  rendererVersion: number;
  againstNumber: number | null;
}) {
  const changed = items.filter((i) => i.changed).length;
  return (
    <section aria-labelledby="prints-h" className="rounded-card border border-line bg-paper-raised p-4">
      <h2 id="prints-h" className="text-lg font-semibold">
        What this edition prints
      </h2>
      <p className="mt-1 text-sm" data-testid="prints-summary">
        Every item below is printed on the poster in these words, besides the cells.{" "}
        {againstNumber === null
          ? "There is no earlier edition to compare with."
          : `${changed} ${changed === 1 ? "item differs" : "items differ"} from edition ${againstNumber}: outlined with a dashed border and marked ◆ changed.`}
      </p>
      <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm">
        <a href={`${pdfUrl}?view=inline`} target="_blank" rel="noopener" className="text-brand-700 underline">
          Open the PDF (in the browser&apos;s viewer)
        </a>
        <a href={pdfUrl} download className="text-brand-700 underline">
          Download the PDF
        </a>
        <span className="text-ink-soft" data-testid="renderer-version">
          Drawn by poster renderer version {rendererVersion}
        </span>
      </p>
      <dl className="mt-3 space-y-2">
        {items.map((i) => (
          <div
            key={i.key}
            data-testid={`print-${i.key}`}
            data-changed={i.changed ? "true" : undefined}
            className="min-w-0 rounded-md border border-line bg-white p-2"
            style={i.changed ? CHANGED : undefined}
          >
            <dt className="text-sm font-semibold">
              {i.changed ? (
                <span>
                  <span aria-hidden>◆ </span>
                  <span className="sr-only">Changed. </span>
                </span>
              ) : null}
              {i.label}
              {i.changed ? <span className="ml-1 text-xs font-normal">(changed)</span> : null}
            </dt>
            {i.lines.map((line, n) => (
              <dd key={n} className="mt-0.5 break-words text-sm">
                {line}
              </dd>
            ))}
            {i.notes.map((note, n) => (
              <dd key={`n${n}`} className="mt-0.5 break-words text-xs text-ink-soft">
                {note}
              </dd>
            ))}
          </div>
        ))}
      </dl>
    </section>
  );
}
