import Link from "next/link";
import { notFound } from "next/navigation";
import { DiffGrid, cellKey, printedWords } from "@/components/sign-off/diff-grid";
import { EditionPrints } from "@/components/sign-off/edition-prints";
import { EditionState } from "@/components/sign-off/edition-state";
import { RuleBreaches } from "@/components/sign-off/rule-breaches";
import { SignOffForm } from "@/components/sign-off/sign-off-form";
import { Caution } from "@/components/ui/caution";
import { StatusBadge } from "@/components/ui/status-badge";
import { forPage, memberForPage } from "@/lib/auth/page-guard";
import { lookupGrid } from "@/lib/charts/snapshot";
import { formatDateTime } from "@/lib/format/dates";
import { formatAxisMm } from "@/lib/poster/marks";
import { labCan } from "@/lib/ops/access";
import { editionReview } from "@/lib/ops/editions";

export const metadata = { title: "Review an edition" };

type Review = Awaited<ReturnType<typeof editionReview>>;

const WAS = { draft: "would replace", returned: "would have replaced", approved: "replaced" } as const;

function ChangeSummary({ review, tz }: { review: Review; tz: string }) {
  const { edition, against, cells } = review;
  const verb = WAS[edition.status as keyof typeof WAS] ?? "replaced";
  return (
    <section aria-labelledby="changes-h" className="rounded-card border border-line bg-paper-raised p-4">
      <h2 id="changes-h" className="text-lg font-semibold">
        What changed
      </h2>
      <p className="mt-1 break-words text-sm" data-testid="diff-summary">
        {against
          ? `Compared with edition ${against.number}, approved${against.approvedAt ? ` on ${formatDateTime(against.approvedAt, tz)}` : ""}${against.approvedByName ? ` by ${against.approvedByName}` : ""}, which this edition ${verb}: `
          : edition.approvedAt
            ? "This edition replaced no earlier edition, so every cell was new: "
            : "No approved edition of this chart exists yet, so every cell is new: "}
        <strong>
          {cells.length} changed {cells.length === 1 ? "cell" : "cells"}
        </strong>
        {cells.length === 0 ? " (only the wording or layout differs, or nothing)." : "."} Changed cells are outlined
        with a dashed border and marked ◆ in both grids; the list below gives each in words.
      </p>
    </section>
  );
}

function Grids({ review }: { review: Review }) {
  const { edition, against, cells } = review;
  const mine = edition.status === "draft" ? "this draft" : edition.status === "returned" ? "sent back" : edition.status;
  return edition.snapshot.lookups.map((l) => {
    const prior = against?.snapshot.lookups.find((b) => b.kind === l.kind) ?? null;
    const changed = new Set(cells.filter((c) => c.lookup === l.kind).map((c) => cellKey(c.row, c.col)));
    return (
      <section key={l.kind} aria-label={`${l.kind} lookup`} className="grid gap-4 xl:grid-cols-2">
        <div className="min-w-0 rounded-card border border-line bg-paper-raised p-3">
          <h3 className="mb-2 break-words text-sm font-semibold">
            {against ? `Edition ${against.number} (${against.status})` : "No earlier edition"}
          </h3>
          {prior && against ? (
            <DiffGrid grid={lookupGrid(against.snapshot, prior)} changed={changed} side="before" />
          ) : (
            <p className="text-sm text-ink-soft">Nothing to compare: this lookup is new.</p>
          )}
        </div>
        <div className="min-w-0 rounded-card border border-line bg-paper-raised p-3">
          <h3 className="mb-2 break-words text-sm font-semibold">
            Edition {edition.number} ({mine})
          </h3>
          <DiffGrid grid={lookupGrid(edition.snapshot, l)} changed={changed} side="after" />
        </div>
      </section>
    );
  });
}

export default async function ReviewEditionPage({ params }: { params: Promise<{ slug: string; editionId: string }> }) {
  const { slug, editionId } = await params;
  const back = `/labs/${slug}/sign-off/${editionId}`;
  const member = await memberForPage(slug, "lab:read", back);
  if (member === "forbidden") return null;
  const review = await forPage(back, () => editionReview(member.caller, { editionId }));
  const { edition, against, cells, prints, breaches } = review;
  if (edition.labId !== member.lab.id) notFound();
  const mayApprove = await labCan(member.lab.id, member.role, "edition:approve");
  const tz = member.lab.timeZone;
  const isDraft = edition.status === "draft";
  return (
    <div className="min-w-0 space-y-6">
      <div>
        <p className="text-sm">
          <Link href={`/labs/${slug}/sign-off`} className="text-brand-700 underline">
            ← Sign-off queue
          </Link>
          {" · "}
          <Link href={`/labs/${slug}/charts/${edition.chartId}`} className="text-brand-700 underline">
            Chart and its editions
          </Link>
        </p>
        <h1 className="mt-2 break-words text-xl font-bold">
          Review {edition.chartTitle} — edition {edition.number}
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-soft">
          <StatusBadge status={edition.status} />
          Drafted by {edition.createdByName ?? "a former member"} on {formatDateTime(edition.createdAt, tz)} ({tz})
        </p>
      </div>
      <EditionState edition={edition} againstNumber={against?.number ?? null} timeZone={tz} />
      {isDraft ? <RuleBreaches breaches={breaches} slug={slug} /> : null}
      <ChangeSummary review={review} tz={tz} />
      <Grids review={review} />
      {cells.length > 0 ? (
        <details className="rounded-card border border-line bg-paper-raised p-4" open={cells.length <= 30}>
          <summary className="cursor-pointer font-semibold">Every changed cell in words ({cells.length})</summary>
          <ol className="mt-2 space-y-1 text-sm tabular-nums" data-testid="diff-list">
            {cells.map((c) => (
              <li key={`${c.lookup}|${c.row}|${c.col}`} className="break-words border-t border-line pt-1">
                <span className="font-medium">
                  {c.lookup}, row {formatAxisMm(c.row)} mm × column {formatAxisMm(c.col)} mm:
                </span>{" "}
                {printedWords(c.before)} → <strong>{printedWords(c.after)}</strong>
              </li>
            ))}
          </ol>
        </details>
      ) : null}
      <EditionPrints
        items={prints}
        pdfUrl={`/api/v1/editions/${edition.id}/pdf`}
        rendererVersion={review.rendererVersion}
        againstNumber={against?.number ?? null}
      />
      <Caution demo={member.lab.isDemo} />
      {!isDraft ? null : !mayApprove ? (
        <p className="rounded-card border border-line bg-paper-raised p-4 text-sm">
          Only those the lab&apos;s rules let approve can sign this edition off.
        </p>
      ) : edition.createdBy === member.user.id ? (
        <p className="rounded-card border border-line bg-paper-raised p-4 text-sm">
          You drafted this edition, so someone else must approve it (four eyes).
        </p>
      ) : (
        <SignOffForm
          slug={slug}
          editionId={edition.id}
          number={edition.number}
          changedCount={cells.length}
          changedItems={prints.filter((p) => p.changed).length}
          breaches={breaches.length}
        />
      )}
    </div>
  );
}
