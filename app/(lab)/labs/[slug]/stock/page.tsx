import { BalloonFamiliesTable } from "@/components/stock/balloon-families-table";
import { StentPlatformsTable } from "@/components/stock/stent-platforms-table";
import { StockHistory } from "@/components/stock/stock-history";
import { StockImport } from "@/components/stock/stock-import";
import { Caution } from "@/components/ui/caution";
import { getStock, listStockHistory } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { can, ROLE_LABELS } from "@/lib/permissions";
import { historyQuery } from "@/lib/validation/stock";

export const metadata = { title: "Stock" };

const HISTORY_PAGE = 20;

export default async function StockPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/stock`);
  if (member === "forbidden") return null;
  const query = historyQuery.safeParse(await searchParams);
  const before = query.success ? query.data.before : undefined;
  const [stock, history] = await Promise.all([
    getStock(member.caller, { lab: slug }),
    listStockHistory(member.caller, { lab: slug }, { before, limit: HISTORY_PAGE + 1 }),
  ]);
  const canEdit = can(member.role, "stock:edit");
  const events = history.slice(0, HISTORY_PAGE);

  return (
    <div className="space-y-10">
      <div className="space-y-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h1 className="text-2xl font-bold">Stock</h1>
          <p className="text-sm text-ink-faint" data-testid="stock-revision">
            Stock revision {stock.revision}
          </p>
        </div>
        {canEdit ? null : (
          <p
            className="rounded-md border border-line bg-paper-raised px-4 py-2 text-sm text-ink-soft"
            data-testid="read-only-note"
          >
            You are viewing this stock as {ROLE_LABELS[member.role].toLowerCase()}: it is read-only for you. Managers of
            the lab keep it up to date.
          </p>
        )}
        <Caution demo={member.lab.isDemo} />
      </div>
      <BalloonFamiliesTable slug={slug} families={stock.balloonFamilies} canEdit={canEdit} />
      <StentPlatformsTable slug={slug} platforms={stock.stentPlatforms} canEdit={canEdit} />
      {canEdit ? <StockImport slug={slug} families={stock.balloonFamilies} /> : null}
      <StockHistory
        slug={slug}
        timeZone={member.lab.timeZone}
        events={events}
        olderCursor={history.length > HISTORY_PAGE ? (events[events.length - 1]?.id ?? null) : null}
      />
    </div>
  );
}
