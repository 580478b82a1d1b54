"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { deletePlatformAction, deleteSizeAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { formatMm } from "@/lib/stock/format";
import type { StentPlatformView, StentSizeView } from "@/lib/stock/types";
import { ConfirmDelete } from "./confirm-delete";
import { PlatformForm } from "./platform-form";
import { SizeForm } from "./size-form";
import { actionsColumn, RowActions, useStockTable } from "./row-actions";
import { StatusLine, type Status } from "./status-line";
import { StockDialog } from "./stock-dialog";
import { StockTable } from "./stock-table";
import { count } from "@/lib/format/plural";

type Dialog =
  | { kind: "platform"; platform?: StentPlatformView }
  | { kind: "delete-platform"; platform: StentPlatformView }
  | { kind: "size"; platform: StentPlatformView; size?: StentSizeView }
  | { kind: "delete-size"; platform: StentPlatformView; size: StentSizeView };

const range = (sizes: StentSizeView[]) =>
  sizes.length ? `${formatMm(sizes[0]!.nominalMm)} – ${formatMm(sizes[sizes.length - 1]!.nominalMm)}` : "—";

export function StentPlatformsTable({
  slug,
  platforms,
  canEdit,
}: {
  slug: string;
  platforms: StentPlatformView[];
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

  const columns = useMemo<ColumnDef<StentPlatformView>[]>(
    () => [
      { accessorKey: "name", header: "Platform", cell: (c) => c.getValue<string>() },
      { id: "count", header: "Sizes", accessorFn: (p) => p.sizes.length },
      {
        id: "range",
        header: "Nominal range (mm)",
        accessorFn: (p) => p.sizes[0]?.nominalMm ?? 0,
        cell: (c) => range(c.row.original.sizes),
      },
      actionsColumn<StentPlatformView>(({ row }) => (
        <RowActions
          name={row.original.name}
          expand={{ open: row.getIsExpanded(), toggle: row.getToggleExpandedHandler() }}
          editLabel="Rename"
          onEdit={canEdit ? () => setDialog({ kind: "platform", platform: row.original }) : undefined}
          onDelete={canEdit ? () => setDialog({ kind: "delete-platform", platform: row.original }) : undefined}
        />
      )),
    ],
    [canEdit],
  );
  const table = useStockTable(platforms, columns, "name", true);

  return (
    <section aria-labelledby="stent-platforms-heading" className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h2 id="stent-platforms-heading" className="text-xl font-semibold">
            Stent platforms
          </h2>
          <p className="text-sm text-ink-soft">
            Nominal diameters with the maximum post-dilatation diameter the lab records for each.
          </p>
        </div>
        {canEdit ? (
          <Button type="button" onClick={() => setDialog({ kind: "platform" })}>
            Add stent platform
          </Button>
        ) : null}
      </div>
      <StatusLine status={status} />
      {platforms.length === 0 ? (
        <EmptyState title="No stent platforms yet">
          {canEdit
            ? "Add a platform, then its nominal sizes with their post-dilatation limits."
            : "A manager of this lab has not recorded any stent platforms yet."}
        </EmptyState>
      ) : (
        <StockTable
          table={table}
          caption="Stent platforms"
          testId="stent-platforms"
          renderDetail={(row) => <PlatformSizes platform={row.original} canEdit={canEdit} onDialog={setDialog} />}
        />
      )}

      <StockDialog open={dialog !== null} title={dialogTitle(dialog)} onClose={() => setDialog(null)}>
        {dialog?.kind === "platform" ? (
          <PlatformForm slug={slug} platform={dialog.platform} onDone={done} onCancel={() => setDialog(null)} />
        ) : null}
        {dialog?.kind === "size" ? (
          <SizeForm
            slug={slug}
            platformId={dialog.platform.id}
            platformName={dialog.platform.name}
            size={dialog.size}
            onDone={done}
            onCancel={() => setDialog(null)}
          />
        ) : null}
        {dialog?.kind === "delete-platform" ? (
          <ConfirmDelete
            action={deletePlatformAction}
            payload={{ slug, platformId: dialog.platform.id }}
            what={dialog.platform.name}
            consequence={
              dialog.platform.sizes.length
                ? `Its ${count(dialog.platform.sizes.length, { one: "size is", other: "sizes are" })} deleted with it.`
                : "It has no sizes."
            }
            onDone={done}
            onCancel={() => setDialog(null)}
          />
        ) : null}
        {dialog?.kind === "delete-size" ? (
          <ConfirmDelete
            action={deleteSizeAction}
            payload={{ slug, sizeId: dialog.size.id }}
            what={`${dialog.platform.name} ${formatMm(dialog.size.nominalMm)} mm`}
            consequence="Charts stop checking post-dilatation against this size."
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
    case "platform":
      return dialog.platform ? `Rename ${dialog.platform.name}` : "Add a stent platform";
    case "size":
      return dialog.size
        ? `Edit ${dialog.platform.name} ${formatMm(dialog.size.nominalMm)} mm`
        : `Add a size to ${dialog.platform.name}`;
    case "delete-platform":
      return "Delete stent platform";
    case "delete-size":
      return "Delete stent size";
    default:
      return "";
  }
}

function PlatformSizes({
  platform,
  canEdit,
  onDialog,
}: {
  platform: StentPlatformView;
  canEdit: boolean;
  onDialog: (d: Dialog) => void;
}) {
  const columns = useMemo<ColumnDef<StentSizeView>[]>(
    () => [
      { accessorKey: "nominalMm", header: "Nominal (mm)", cell: (c) => formatMm(c.getValue<number>()) },
      {
        accessorKey: "maxPostDilatationMm",
        header: "Max post-dilatation (mm)",
        cell: (c) => formatMm(c.getValue<number>()),
      },
      ...(canEdit
        ? [
            actionsColumn<StentSizeView>(({ row }) => (
              <RowActions
                name={`${formatMm(row.original.nominalMm)} mm`}
                onEdit={() => onDialog({ kind: "size", platform, size: row.original })}
                onDelete={() => onDialog({ kind: "delete-size", platform, size: row.original })}
              />
            )),
          ]
        : []),
    ],
    [platform, canEdit, onDialog],
  );
  const table = useStockTable(platform.sizes, columns, "nominalMm");
  return (
    <div className="space-y-2 pl-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold">Sizes of {platform.name}</h3>
        {canEdit ? (
          <Button
            type="button"
            variant="secondary"
            className="py-1"
            onClick={() => onDialog({ kind: "size", platform })}
          >
            Add size<span className="sr-only"> to {platform.name}</span>
          </Button>
        ) : null}
      </div>
      {platform.sizes.length === 0 ? (
        <p className="text-sm text-ink-soft">No sizes recorded for this platform yet.</p>
      ) : (
        <div className="max-w-xl">
          <StockTable dense table={table} caption={`Sizes of ${platform.name}`} testId={`stent-sizes-${platform.id}`} />
        </div>
      )}
    </div>
  );
}
