"use client";

import {
  getCoreRowModel,
  getExpandedRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ExpandedState,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { Button } from "@/components/ui/button";

/** The buttons at the end of a stock row; `name` completes each button's accessible name. */
export function RowActions({
  name,
  expand,
  editLabel = "Edit",
  onEdit,
  onDelete,
}: {
  name: string;
  expand?: { open: boolean; toggle: () => void };
  editLabel?: string;
  onEdit?: () => void;
  onDelete?: () => void;
}) {
  return (
    <div className="flex justify-end gap-1 whitespace-nowrap">
      {expand ? (
        <Button type="button" variant="ghost" className="px-2 py-1" aria-expanded={expand.open} onClick={expand.toggle}>
          {expand.open ? "Hide sizes" : "Show sizes"}
          <span className="sr-only"> of {name}</span>
        </Button>
      ) : null}
      {onEdit ? (
        <Button type="button" variant="ghost" className="px-2 py-1" onClick={onEdit}>
          {editLabel}
          <span className="sr-only"> {name}</span>
        </Button>
      ) : null}
      {onDelete ? (
        <Button type="button" variant="ghost" className="px-2 py-1 text-danger" onClick={onDelete}>
          Delete<span className="sr-only"> {name}</span>
        </Button>
      ) : null}
    </div>
  );
}

export const actionsColumn = <T,>(cell: ColumnDef<T>["cell"]): ColumnDef<T> => ({
  id: "actions",
  header: () => <span className="sr-only">Actions</span>,
  enableSorting: false,
  cell,
});

/** A sortable stock table (rows expandable when `expandable`), keyed by the rows' ids. */
export function useStockTable<T extends { id: number }>(
  data: T[],
  columns: ColumnDef<T>[],
  sortBy: string,
  expandable = false,
) {
  const [sorting, setSorting] = useState<SortingState>([{ id: sortBy, desc: false }]);
  const [expanded, setExpanded] = useState<ExpandedState>(true);
  // TanStack's table object is rebuilt every render by design; the compiler cannot memoize it.
  // eslint-disable-next-line react-hooks/incompatible-library
  return useReactTable({
    data,
    columns,
    state: expandable ? { sorting, expanded } : { sorting },
    onSortingChange: setSorting,
    onExpandedChange: setExpanded,
    getRowId: (row) => String(row.id),
    getRowCanExpand: () => expandable,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getExpandedRowModel: getExpandedRowModel(),
  });
}
