"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { deleteBalloonAction, deleteFamilyAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { formatAtm, formatMm } from "@/lib/stock/format";
import type { BalloonFamilyView, BalloonView } from "@/lib/stock/types";
import { COMPLIANCE_LABELS } from "@/lib/validation/stock";
import { BalloonForm } from "./balloon-form";
import { ConfirmDelete } from "./confirm-delete";
import { FamilyForm } from "./family-form";
import { InStockToggle } from "./in-stock-toggle";
import { actionsColumn, RowActions, useStockTable } from "./row-actions";
import { StatusLine, type Status } from "./status-line";
import { StockDialog } from "./stock-dialog";
import { StockTable } from "./stock-table";
import { count } from "@/lib/format/plural";

type Dialog =
  | { kind: "family"; family?: BalloonFamilyView }
  | { kind: "delete-family"; family: BalloonFamilyView }
  | { kind: "balloon"; family: BalloonFamilyView; balloon?: BalloonView }
  | { kind: "delete-balloon"; family: BalloonFamilyView; balloon: BalloonView };

export function BalloonFamiliesTable({
  slug,
  families,
  canEdit,
}: {
  slug: string;
  families: BalloonFamilyView[];
  canEdit: boolean;
}) {
  const router = useRouter();
  const [dialog, setDialog] = useState<Dialog | null>(null);
  const [status, setStatus] = useState<Status | null>(null);

  const done = (text: string) => {
    setDialog(null);
    setStatus({ kind: "ok", text });
    router.refresh();
  };
  const failed = (text: string) => setStatus({ kind: "error", text });

  const columns = useMemo<ColumnDef<BalloonFamilyView>[]>(
    () => [
      { accessorKey: "name", header: "Family", cell: (c) => c.getValue<string>() },
      { accessorKey: "compliance", header: "Compliance", cell: (c) => COMPLIANCE_LABELS[c.row.original.compliance] },
      { accessorKey: "nominalAtm", header: "Nominal (atm)", cell: (c) => formatAtm(c.getValue<number>()) },
      { accessorKey: "rbpAtm", header: "Rated burst (atm)", cell: (c) => formatAtm(c.getValue<number>()) },
      {
        accessorKey: "growthAtRbpMm",
        header: "Growth at RBP (mm)",
        sortUndefined: "last",
        cell: (c) => {
          const v = c.getValue<number | null>();
          return v === null ? <span className="text-ink-faint">not recorded</span> : formatMm(v);
        },
      },
      {
        id: "sizes",
        header: "Sizes in stock",
        accessorFn: (f) => f.balloons.filter((b) => b.inStock).length,
        cell: (c) => `${c.getValue<number>()} of ${c.row.original.balloons.length}`,
      },
      actionsColumn<BalloonFamilyView>(({ row }) => (
        <RowActions
          name={row.original.name}
          expand={{ open: row.getIsExpanded(), toggle: row.getToggleExpandedHandler() }}
          editLabel="Edit"
          onEdit={canEdit ? () => setDialog({ kind: "family", family: row.original }) : undefined}
          onDelete={canEdit ? () => setDialog({ kind: "delete-family", family: row.original }) : undefined}
        />
      )),
    ],
    [canEdit],
  );

  const table = useStockTable(families, columns, "name", true);

  return (
    <section aria-labelledby="balloon-families-heading" className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h2 id="balloon-families-heading" className="text-xl font-semibold">
            Balloon families
          </h2>
          <p className="text-sm text-ink-soft">
            Each family&apos;s pressures and the diameters on the shelf. Sort by any column; open a family to see its
            sizes.
          </p>
        </div>
        {canEdit ? (
          <Button type="button" onClick={() => setDialog({ kind: "family" })}>
            Add balloon family
          </Button>
        ) : null}
      </div>
      <StatusLine status={status} />
      {families.length === 0 ? (
        <EmptyState title="No balloon families yet">
          {canEdit
            ? "Add a family with its pressures, then its diameters, or import a CSV file below."
            : "A manager of this lab has not recorded any balloons yet."}
        </EmptyState>
      ) : (
        <StockTable
          table={table}
          caption="Balloon families"
          testId="balloon-families"
          renderDetail={(row) => (
            <BalloonSizes
              slug={slug}
              family={row.original}
              canEdit={canEdit}
              onDialog={setDialog}
              onSaved={(t) => setStatus({ kind: "ok", text: t })}
              onError={failed}
              onChanged={() => router.refresh()}
            />
          )}
        />
      )}

      <StockDialog open={dialog !== null} title={dialogTitle(dialog)} onClose={() => setDialog(null)}>
        {dialog?.kind === "family" ? (
          <FamilyForm slug={slug} family={dialog.family} onDone={done} onCancel={() => setDialog(null)} />
        ) : null}
        {dialog?.kind === "balloon" ? (
          <BalloonForm
            slug={slug}
            familyId={dialog.family.id}
            familyName={dialog.family.name}
            balloon={dialog.balloon}
            onDone={done}
            onCancel={() => setDialog(null)}
          />
        ) : null}
        {dialog?.kind === "delete-family" ? (
          <ConfirmDelete
            action={deleteFamilyAction}
            payload={{ slug, familyId: dialog.family.id }}
            what={dialog.family.name}
            consequence={
              dialog.family.balloons.length
                ? `Its ${count(dialog.family.balloons.length, { one: "size is", other: "sizes are" })} deleted with it.`
                : "It has no sizes."
            }
            onDone={done}
            onCancel={() => setDialog(null)}
          />
        ) : null}
        {dialog?.kind === "delete-balloon" ? (
          <ConfirmDelete
            action={deleteBalloonAction}
            payload={{ slug, balloonId: dialog.balloon.id }}
            what={`${dialog.family.name} ${formatMm(dialog.balloon.diameterMm)} mm`}
            consequence="To keep the size on record but off the charts, mark it out of stock instead."
            onDone={done}
            onCancel={() => setDialog(null)}
          />
        ) : null}
      </StockDialog>
    </section>
  );
}

function dialogTitle(dialog: Dialog | null): string {
  switch (dialog?.kind) {
    case "family":
      return dialog.family ? `Edit ${dialog.family.name}` : "Add a balloon family";
    case "balloon":
      return dialog.balloon
        ? `Edit ${dialog.family.name} ${formatMm(dialog.balloon.diameterMm)} mm`
        : `Add a size to ${dialog.family.name}`;
    case "delete-family":
      return "Delete balloon family";
    case "delete-balloon":
      return "Delete balloon size";
    default:
      return "";
  }
}

function BalloonSizes({
  slug,
  family,
  canEdit,
  onDialog,
  onSaved,
  onError,
  onChanged,
}: {
  slug: string;
  family: BalloonFamilyView;
  canEdit: boolean;
  onDialog: (d: Dialog) => void;
  onSaved: (text: string) => void;
  onError: (text: string) => void;
  onChanged: () => void;
}) {
  const columns = useMemo<ColumnDef<BalloonView>[]>(
    () => [
      { accessorKey: "diameterMm", header: "Diameter (mm)", cell: (c) => formatMm(c.getValue<number>()) },
      {
        accessorKey: "inStock",
        header: "In stock",
        sortingFn: "basic",
        cell: ({ row }) => (
          <InStockToggle
            key={`${row.original.id}-${row.original.inStock}`}
            slug={slug}
            family={family.name}
            balloon={row.original}
            canEdit={canEdit}
            onSaved={(t) => {
              onSaved(t);
              onChanged();
            }}
            onError={onError}
          />
        ),
      },
      ...(canEdit
        ? [
            actionsColumn<BalloonView>(({ row }) => (
              <RowActions
                name={`${formatMm(row.original.diameterMm)} mm`}
                onEdit={() => onDialog({ kind: "balloon", family, balloon: row.original })}
                onDelete={() => onDialog({ kind: "delete-balloon", family, balloon: row.original })}
              />
            )),
          ]
        : []),
    ],
    [slug, family, canEdit, onDialog, onSaved, onError, onChanged],
  );
  const table = useStockTable(family.balloons, columns, "diameterMm");
  return (
    <div className="space-y-2 pl-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold">Sizes of {family.name}</h3>
        {canEdit ? (
          <Button
            type="button"
            variant="secondary"
            className="py-1"
            onClick={() => onDialog({ kind: "balloon", family })}
          >
            Add size<span className="sr-only"> to {family.name}</span>
          </Button>
        ) : null}
      </div>
      {family.balloons.length === 0 ? (
        <p className="text-sm text-ink-soft">No sizes recorded for this family yet.</p>
      ) : (
        <div className="max-w-xl">
          <StockTable dense table={table} caption={`Sizes of ${family.name}`} testId={`sizes-${family.id}`} />
        </div>
      )}
    </div>
  );
}
