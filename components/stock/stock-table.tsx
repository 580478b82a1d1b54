"use client";

import { flexRender, type Row, type Table } from "@tanstack/react-table";
import { Fragment, type ReactNode } from "react";

/** Renders a TanStack table with sortable headers (buttons, aria-sort) and optional detail rows. */
export function StockTable<T>({
  table,
  caption,
  renderDetail,
  testId,
  dense = false,
}: {
  table: Table<T>;
  caption: string;
  renderDetail?: (row: Row<T>) => ReactNode;
  testId?: string;
  dense?: boolean;
}) {
  const columns = table.getVisibleLeafColumns().length;
  const pad = dense ? "px-3 py-1" : "px-3 py-2";
  return (
    <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
      <table className="w-full border-collapse text-sm" data-testid={testId}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper-sunk text-left">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={
                      canSort ? (sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none") : undefined
                    }
                    className="whitespace-nowrap px-3 py-2 font-semibold text-ink-soft"
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 rounded hover:text-ink"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden className="text-xs">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                        </span>
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <Fragment key={row.id}>
              <tr className="border-t border-line align-middle">
                {row.getVisibleCells().map((cell, i) =>
                  i === 0 ? (
                    <th key={cell.id} scope="row" className={`${pad} text-left font-medium`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </th>
                  ) : (
                    <td key={cell.id} className={pad}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ),
                )}
              </tr>
              {renderDetail && row.getIsExpanded() ? (
                <tr className="border-t border-line bg-paper">
                  <td colSpan={columns} className="px-3 py-3">
                    {renderDetail(row)}
                  </td>
                </tr>
              ) : null}
            </Fragment>
          ))}
        </tbody>
      </table>
    </div>
  );
}
