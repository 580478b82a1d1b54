import Link from "next/link";
import { StaleMailToggle } from "@/components/lab/stale-mail-toggle";
import { FirstRun } from "@/components/labs/first-run";
import { buttonClass } from "@/components/ui/button";
import { Caution } from "@/components/ui/caution";
import { EmptyState } from "@/components/ui/empty-state";
import { StatusBadge } from "@/components/ui/status-badge";
import { listCharts } from "@/lib/ops/charts";
import { firstRun } from "@/lib/ops/first-run";
import { getStaleMail } from "@/lib/ops/members";
import { roomBoard } from "@/lib/ops/postings";
import { memberForPage } from "@/lib/auth/page-guard";
import { STALE } from "@/lib/editions/check";
import { can } from "@/lib/permissions";
import { lawName } from "@/lib/sizing";

export default async function LabPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}`);
  if (member === "forbidden") return null;
  const [charts, board, mail, steps] = await Promise.all([
    listCharts(member.caller, { lab: slug }),
    roomBoard(member.caller, { lab: slug }),
    getStaleMail(member.caller, { lab: slug }),
    firstRun(member.caller, { lab: slug }),
  ]);
  // Managers of a lab that has not printed its first approved chart yet are walked through it.
  const showFirstRun = member.role === "manager" && steps.some((s) => !s.done);
  const stale = board.flatMap((r) =>
    r.postings.filter((p) => STALE.includes(p.status)).map((p) => ({ ...p, room: r.name })),
  );
  const posted = board.reduce((n, r) => n + r.postings.length, 0);
  return (
    <div className="space-y-8">
      <h1 className="sr-only">{member.lab.name}: overview</h1>
      {showFirstRun ? <FirstRun steps={steps} /> : null}
      <section
        aria-labelledby="walls-h"
        className={`rounded-card border p-5 ${stale.length ? "border-warn/60 bg-warn-soft" : "border-line bg-paper-raised"}`}
      >
        <h2 id="walls-h" className="text-lg font-semibold">
          {stale.length
            ? `! ${stale.length} printout${stale.length > 1 ? "s" : ""} on the walls to replace`
            : `✓ All ${posted} recorded printout${posted === 1 ? " is" : "s are"} current`}
        </h2>
        {stale.length ? (
          <ul className="mt-2 list-disc pl-5">
            {stale.slice(0, 6).map((p) => (
              <li key={p.postingId}>
                {p.room}: {p.chartTitle}, edition {p.editionNumber} — {p.status}
                {p.changes[0] ? ` (${p.changes[0]})` : ""}
              </li>
            ))}
          </ul>
        ) : null}
        <Link href={`/labs/${slug}/rooms`} className="mt-3 inline-block text-brand-700 underline">
          Open the room board
        </Link>
      </section>

      <section aria-labelledby="charts-h">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id="charts-h" className="text-lg font-semibold">
            Wall charts
          </h2>
          {can(member.role, "chart:design") ? (
            <Link href={`/labs/${slug}/charts/new`} className={buttonClass("secondary", "py-1.5")}>
              New chart
            </Link>
          ) : null}
        </div>
        {charts.length === 0 ? (
          <div className="mt-3">
            <EmptyState title="No wall charts yet">
              Charts built from this lab&apos;s stock and chosen law will be listed here, with the status of every
              printed copy.
            </EmptyState>
          </div>
        ) : (
          <ul className="mt-3 grid gap-3 sm:grid-cols-2">
            {charts.map(({ chart, current }) => (
              <li key={chart.id}>
                <Link
                  href={`/labs/${slug}/charts/${chart.id}`}
                  className="block rounded-card border border-line bg-paper-raised p-4 hover:border-brand-500"
                >
                  <span className="block font-semibold">{chart.title}</span>
                  <span className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-faint">
                    {lawName(chart.definition.law)}
                    {current ? (
                      <StatusBadge
                        status={current.status}
                        label={`${current.status === "approved" ? "Approved" : "Draft"} · edition ${current.number}`}
                      />
                    ) : (
                      <StatusBadge status="none" />
                    )}
                    {current?.status === "approved" && chart.liveFingerprint !== current.fingerprint ? (
                      <StatusBadge status="outdated" label="Needs a new edition" />
                    ) : null}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>

      {member.role === "educator" ? (
        <section aria-label="Your e-mail setting">
          <StaleMailToggle slug={slug} initial={mail} />
        </section>
      ) : member.role === "manager" ? (
        <p className="text-sm text-ink-soft">
          As a manager you get an e-mail whenever printed copies on the walls go stale.
        </p>
      ) : null}
      <Caution demo={member.lab.isDemo} />
    </div>
  );
}
