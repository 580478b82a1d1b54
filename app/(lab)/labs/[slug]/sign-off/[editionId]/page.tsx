import Link from "next/link";
import { notFound } from "next/navigation";
import { DiffGrid, cellKey, printedWords } from "@/components/sign-off/diff-grid";
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

export default async function ReviewEditionPage({ params }: { params: Promise<{ slug: string; editionId: string }> }) {
  const { slug, editionId } = await params;
  const back = `/labs/${slug}/sign-off/${editionId}`;
  const member = await memberForPage(slug, "lab:read", back);
  if (member === "forbidden") return null;
  const { edition, against, cells } = await forPage(back, () => editionReview(member.caller, { editionId }));
  if (edition.labId !== member.lab.id) notFound();
  const mayApprove = await labCan(member.lab.id, member.role, "edition:approve");
  const lookups = edition.snapshot.lookups.map((l) => {
    const before = against?.snapshot.lookups.find((b) => b.kind === l.kind) ?? null;
    const changed = new Set(cells.filter((c) => c.lookup === l.kind).map((c) => cellKey(c.row, c.col)));
    return {
      kind: l.kind,
      after: lookupGrid(edition.snapshot, l),
      before: before && against ? lookupGrid(against.snapshot, before) : null,
      changed,
    };
  });
  const words = (a: string, b: string) => (a === b ? a : `${a} → ${b}`);
  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm">
          <Link href={`/labs/${slug}/sign-off`} className="text-brand-700 underline">
            ← Sign-off queue
          </Link>
        </p>
        <h1 className="mt-2 text-xl font-bold">
          Review {edition.chartTitle} — edition {edition.number}
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-soft">
          <StatusBadge status={edition.status} />
          Drafted by {edition.createdByName ?? "a former member"} on {formatDateTime(edition.createdAt)} UTC
        </p>
      </div>
      <section aria-labelledby="changes-h" className="rounded-card border border-line bg-paper-raised p-4">
        <h2 id="changes-h" className="text-lg font-semibold">
          What changed
        </h2>
        <p className="mt-1 text-sm" data-testid="diff-summary">
          {against
            ? `Compared with edition ${against.number}, approved${against.approvedAt ? ` on ${formatDateTime(against.approvedAt)} UTC` : ""}${against.approvedByName ? ` by ${against.approvedByName}` : ""}, which this edition would replace: `
            : "No approved edition of this chart exists yet, so every cell is new: "}
          <strong>
            {cells.length} changed {cells.length === 1 ? "cell" : "cells"}
          </strong>
          {cells.length === 0 ? " (only the wording or layout differs, or nothing)." : "."} Changed cells are outlined
          with a dashed border and marked ◆ in both grids; the list below gives each in words.
        </p>
        {against &&
        (against.snapshot.title !== edition.snapshot.title || against.snapshot.notes !== edition.snapshot.notes) ? (
          <ul className="mt-2 list-disc pl-5 text-sm">
            {against.snapshot.title !== edition.snapshot.title ? (
              <li>Title: {words(against.snapshot.title, edition.snapshot.title)}</li>
            ) : null}
            {against.snapshot.notes !== edition.snapshot.notes ? (
              <li>Notes changed: “{edition.snapshot.notes || "(none)"}”</li>
            ) : null}
          </ul>
        ) : null}
      </section>
      {lookups.map((l) => (
        <section key={l.kind} aria-label={`${l.kind} lookup`} className="grid gap-4 xl:grid-cols-2">
          <div className="min-w-0 rounded-card border border-line bg-paper-raised p-3">
            <h3 className="mb-2 text-sm font-semibold">
              {against ? `Edition ${against.number} (on the wall now)` : "No approved edition yet"}
            </h3>
            {l.before ? (
              <DiffGrid grid={l.before} changed={l.changed} side="before" />
            ) : (
              <p className="text-sm text-ink-soft">Nothing to compare: this lookup is new.</p>
            )}
          </div>
          <div className="min-w-0 rounded-card border border-line bg-paper-raised p-3">
            <h3 className="mb-2 text-sm font-semibold">Edition {edition.number} (this draft)</h3>
            <DiffGrid grid={l.after} changed={l.changed} side="after" />
          </div>
        </section>
      ))}
      {cells.length > 0 ? (
        <details className="rounded-card border border-line bg-paper-raised p-4" open={cells.length <= 30}>
          <summary className="cursor-pointer font-semibold">Every changed cell in words ({cells.length})</summary>
          <ol className="mt-2 space-y-1 text-sm tabular-nums" data-testid="diff-list">
            {cells.map((c) => (
              <li key={`${c.lookup}|${c.row}|${c.col}`} className="border-t border-line pt-1">
                <span className="font-medium">
                  {c.lookup}, row {formatAxisMm(c.row)} mm × column {formatAxisMm(c.col)} mm:
                </span>{" "}
                {printedWords(c.before)} → <strong>{printedWords(c.after)}</strong>
              </li>
            ))}
          </ol>
        </details>
      ) : null}
      <Caution demo={member.lab.isDemo} />
      {edition.status !== "draft" ? (
        <p className="rounded-card border border-line bg-paper-raised p-4 text-sm">
          Edition {edition.number} is {edition.status === "returned" ? "sent back" : edition.status}: there is nothing
          to sign off.
          {edition.rejectionReason && edition.status === "returned" ? ` Reason: ${edition.rejectionReason}` : ""}
        </p>
      ) : !mayApprove ? (
        <p className="rounded-card border border-line bg-paper-raised p-4 text-sm">
          Only those the lab&apos;s rules let approve can sign this edition off.
        </p>
      ) : edition.createdBy === member.user.id ? (
        <p className="rounded-card border border-line bg-paper-raised p-4 text-sm">
          You drafted this edition, so someone else must approve it (four eyes).
        </p>
      ) : (
        <SignOffForm slug={slug} editionId={edition.id} number={edition.number} changedCount={cells.length} />
      )}
    </div>
  );
}
