import Link from "next/link";
import { LiveCheck } from "@/components/check/live-check";
import { PostingForm } from "@/components/check/posting-form";
import { buttonClass } from "@/components/ui/button";
import { Caution } from "@/components/ui/caution";
import { isRateLimited, limitPublic } from "@/lib/auth/public-limit";
import { requestAddress } from "@/lib/auth/request-address";
import { pdfUrlFor } from "@/lib/charts/present";
import { checkJson } from "@/lib/editions/check-json";
import { env } from "@/lib/env";
import { formatDate } from "@/lib/format/dates";
import { forPage } from "@/lib/auth/page-guard";
import { sessionCaller } from "@/lib/ops/caller";
import { checkPage } from "@/lib/ops/postings";
import { can } from "@/lib/permissions";

export const dynamic = "force-dynamic";
export const metadata = { title: "Is this printout current?", robots: { index: false } };

export default async function CheckPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const limited = await limitPublic("check", await requestAddress()).then(
    () => null,
    (e: unknown) => (isRateLimited(e) ? e : Promise.reject(e)),
  );
  if (limited)
    return (
      <div className="mx-auto max-w-xl" role="alert">
        <h1 className="text-xl font-bold">This printout cannot be verified right now</h1>
        <p className="mt-2">{limited.message} Until it is verified, do not rely on its numbers.</p>
      </div>
    );
  const { view, role, rooms, hanging } = await forPage(`/v/${token}/lab`, async () =>
    checkPage(await sessionCaller(), { token }),
  );
  // Only an approved edition that matches today's chart is offered for printing.
  const printId = view.action === "replace" ? view.currentEdition?.id : undefined;

  return (
    <div className="mx-auto max-w-xl">
      <LiveCheck token={token} initial={checkJson(view)} />
      {role ? (
        <>
          <div className="mt-6 flex flex-wrap gap-2">
            {printId ? (
              <a href={pdfUrlFor(env.APP_URL, printId)} className={buttonClass("primary")}>
                Print the current edition
              </a>
            ) : null}
            <Link href={`/labs/${view.lab.slug}/charts/${view.chart.id}`} className={buttonClass("secondary")}>
              Open the chart
            </Link>
          </div>
          <PostingForm
            token={token}
            rooms={rooms.map((r) => ({ id: r.id, name: r.name }))}
            hanging={hanging.map((h) => ({
              postingId: h.postingId,
              roomName: h.roomName,
              postedOn: formatDate(h.postedAt, view.lab.timeZone),
            }))}
            canPost={can(role, "posting:record") && (view.status === "current" || view.status === "outdated")}
          />
        </>
      ) : (
        <p className="mt-6 text-base text-ink-soft">
          Lab members can{" "}
          <Link
            href={`/sign-in?callbackUrl=/v/${token}/lab`}
            className="inline-flex min-h-11 items-center text-brand-700 underline"
          >
            sign in
          </Link>{" "}
          to record where this copy hangs or to print the current edition.
        </p>
      )}
      <Caution className="mt-8" demo={view.lab.isDemo} />
    </div>
  );
}
