import { AddRoomForm, RestoreButton, RoomMenu, TakeDownButton } from "@/components/rooms/room-controls";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { StatusBadge } from "@/components/ui/status-badge";
import { recentlyTakenDown, roomBoard } from "@/lib/ops/postings";
import { count } from "@/lib/format/plural";
import { formatDateTime } from "@/lib/format/dates";
import { memberForPage } from "@/lib/auth/page-guard";
import { pdfUrlFor } from "@/lib/charts/present";
import { STALE } from "@/lib/editions/check";
import { env } from "@/lib/env";
import { can } from "@/lib/permissions";
import { formatDate } from "@/lib/format/dates";

export const metadata = { title: "Rooms" };

export default async function RoomsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/rooms`);
  if (member === "forbidden") return null;
  const [board, removed] = await Promise.all([
    roomBoard(member.caller, { lab: slug }),
    recentlyTakenDown(member.caller, { lab: slug }),
  ]);
  const manager = can(member.role, "rooms:manage");
  const staleCount = board.reduce((n, r) => n + r.stale, 0);
  return (
    <div>
      <h1 className="text-2xl font-bold">Rooms and what hangs there</h1>
      <p className="mt-1 text-ink-soft">
        {staleCount
          ? `${count(staleCount, { one: "printout", other: "printouts" })} to replace; stale ones are listed first.`
          : "Every recorded printout is current."}{" "}
        Record a copy from its check page (scan the QR code while signed in).
      </p>
      {manager ? (
        <div className="mt-4">
          <AddRoomForm slug={slug} />
        </div>
      ) : null}
      {board.length === 0 ? (
        <div className="mt-6">
          <EmptyState title="No rooms yet">
            {manager ? "Add the procedure and control rooms where charts hang." : "A manager adds the lab's rooms."}
          </EmptyState>
        </div>
      ) : (
        <ul className="mt-6 space-y-4">
          {board.map((room) => (
            <li
              key={room.id}
              className="rounded-card border border-line bg-paper-raised p-4"
              data-testid={`room-${room.name}`}
            >
              <div className="flex flex-wrap items-center justify-between gap-2">
                <h2 className="text-lg font-semibold">
                  {room.name} {room.stale ? <StatusBadge status="outdated" label={`${room.stale} to replace`} /> : null}
                </h2>
                {manager ? (
                  <RoomMenu slug={slug} roomId={room.id} name={room.name} empty={room.postings.length === 0} />
                ) : null}
              </div>
              {room.postings.length === 0 ? (
                <p className="mt-2 text-sm text-ink-faint">Nothing recorded on this wall.</p>
              ) : (
                <ul className="mt-3 divide-y divide-line">
                  {room.postings.map((p) => (
                    <li key={p.postingId} className="flex flex-wrap items-start gap-3 py-3">
                      <div className="min-w-0 flex-1">
                        <p className="font-medium">
                          {p.chartTitle} · edition {p.editionNumber} <StatusBadge status={p.status} />
                        </p>
                        {p.changes.length ? (
                          <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft">
                            {p.changes.slice(0, 4).map((c, i) => (
                              <li key={i}>{c}</li>
                            ))}
                          </ul>
                        ) : null}
                        <p className="text-xs text-ink-faint">
                          Posted {formatDate(p.postedAt, member.lab.timeZone)}
                          {p.postedByName ? ` by ${p.postedByName}` : ""}
                        </p>
                      </div>
                      {STALE.includes(p.status) && p.currentEdition ? (
                        <a
                          href={pdfUrlFor(env.APP_URL, p.currentEdition.id)}
                          className={buttonClass("primary", "py-1 text-sm")}
                        >
                          Print edition {p.currentEdition.number}
                        </a>
                      ) : null}
                      <TakeDownButton slug={slug} postingId={p.postingId} label={`${p.chartTitle} in ${room.name}`} />
                    </li>
                  ))}
                </ul>
              )}
            </li>
          ))}
        </ul>
      )}
      {removed.length ? (
        <section aria-labelledby="removed-h" className="mt-8">
          <h2 id="removed-h" className="text-lg font-semibold">
            Taken down in the last day
          </h2>
          <p className="text-sm text-ink-soft">Recorded by mistake? Put a copy back on its room&apos;s list.</p>
          <ul className="mt-2 divide-y divide-line rounded-md border border-line">
            {removed.map((r) => (
              <li key={r.postingId} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
                <span>
                  {r.chartTitle}, edition {r.editionNumber}, in {r.room}
                  <span className="text-sm text-ink-faint">
                    {" "}
                    · taken down {r.removedAt ? formatDateTime(r.removedAt, member.lab.timeZone) : ""}
                  </span>
                </span>
                <RestoreButton slug={slug} postingId={r.postingId} label={`${r.chartTitle} in ${r.room}`} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
