import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { memberForPage, forPage } from "@/lib/auth/page-guard";
import { formatAge } from "@/lib/format/age";
import { formatDateTime } from "@/lib/format/dates";
import { signOffQueue } from "@/lib/ops/editions";

export const metadata = { title: "Sign-off" };

export default async function SignOffQueuePage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const back = `/labs/${slug}/sign-off`;
  const member = await memberForPage(slug, "edition:approve", back);
  if (member === "forbidden") return <Forbidden what="approve editions" slug={slug} />;
  const drafts = await forPage(back, () => signOffQueue(member.caller, { lab: slug }));
  const now = new Date();
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-xl font-bold">Waiting for sign-off</h1>
        <p className="text-sm text-ink-soft">
          Drafts of this lab&apos;s charts, oldest first. Open one to compare it with the edition it replaces.
        </p>
      </div>
      {drafts.length === 0 ? (
        <EmptyState title="Nothing waits for sign-off">
          When an educator creates an edition of a chart, it appears here until someone approves it or sends it back.
        </EmptyState>
      ) : (
        <ol className="space-y-3" aria-label="Drafts waiting, oldest first">
          {drafts.map((d) => {
            const mine = d.createdBy === member.user.id;
            return (
              <li key={d.id} className="rounded-card border border-line bg-paper-raised p-4" data-testid="queue-item">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <Link
                    href={`/labs/${slug}/sign-off/${d.id}`}
                    className="text-lg font-semibold text-brand-700 underline"
                  >
                    {d.chartTitle} — edition {d.number}
                  </Link>
                  <span className="text-sm text-ink-soft">waiting {formatAge(d.createdAt, now)}</span>
                </div>
                <p className="mt-1 text-sm text-ink-soft">
                  Drafted by {d.createdByName ?? "a former member"} on {formatDateTime(d.createdAt)} UTC
                  {mine ? " · you drafted it, so someone else signs it off" : ""}
                </p>
              </li>
            );
          })}
        </ol>
      )}
    </div>
  );
}
