import Link from "next/link";
import { notFound } from "next/navigation";
import { LiveCheck } from "@/components/check/live-check";
import { PostingForm } from "@/components/check/posting-form";
import { buttonClass } from "@/components/ui/button";
import { Caution } from "@/components/ui/caution";
import { getCheckByToken } from "@/db/queries/check";
import { findLabWithRole } from "@/db/queries/members";
import { listPostingsForEdition, listRooms } from "@/db/queries/rooms";
import { currentUser } from "@/lib/auth/session";
import { pdfUrlFor } from "@/lib/charts/present";
import { checkJson } from "@/lib/editions/check-json";
import { env } from "@/lib/env";
import { can } from "@/lib/permissions";
import { checkTokenSchema } from "@/lib/validation/check";

export const dynamic = "force-dynamic";
export const metadata = { title: "Is this printout current?", robots: { index: false } };

export default async function CheckPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  if (!checkTokenSchema.safeParse(token).success) notFound();
  const view = await getCheckByToken({ token });
  if (!view) notFound();
  const user = await currentUser();
  const membership = user ? await findLabWithRole({ slug: view.lab.slug, userId: user.id }) : null;
  const role = membership?.role ?? null;
  const [rooms, hanging] = role
    ? await Promise.all([
        listRooms({ labId: view.lab.id }),
        listPostingsForEdition({ labId: view.lab.id, editionId: view.edition.id }),
      ])
    : [[], []];
  const printId = view.status === "current" ? view.edition.id : view.currentEdition?.id;

  return (
    <div className="mx-auto max-w-xl">
      <h1 className="sr-only">Is this printout current?</h1>
      <LiveCheck token={token} initial={checkJson(view)} />
      {role ? (
        <>
          <div className="mt-6 flex flex-wrap gap-2">
            {printId && view.status !== "current" ? (
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
            hanging={hanging.map((h) => ({ ...h, postedAt: h.postedAt.toISOString() }))}
            canPost={can(role, "posting:record") && (view.status === "current" || view.status === "outdated")}
          />
        </>
      ) : (
        <p className="mt-6 text-sm text-ink-soft">
          Lab members can{" "}
          <Link href={`/sign-in?callbackUrl=/v/${token}`} className="text-brand-700 underline">
            sign in
          </Link>{" "}
          to record where this copy hangs or to print the current edition.
        </p>
      )}
      <Caution className="mt-8" demo={view.lab.isDemo} />
    </div>
  );
}
