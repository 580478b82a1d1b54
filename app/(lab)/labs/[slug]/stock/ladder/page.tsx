import Link from "next/link";
import { LadderForm } from "@/components/labs/ladder-form";
import { Caution } from "@/components/ui/caution";
import { Forbidden } from "@/components/ui/forbidden";
import { memberForPage } from "@/lib/auth/page-guard";
import { LADDER_FROM_MM, LADDER_STEP_MM, LADDER_TO_MM } from "@/lib/labs/first-run";
import { formatMm } from "@/lib/stock/format";

export const metadata = { title: "Start from a size ladder" };

export default async function LadderPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "stock:edit", `/labs/${slug}/stock/ladder`);
  if (member === "forbidden") return <Forbidden what="edit the stock" slug={slug} />;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Start from a generic size ladder</h1>
      <p className="max-w-prose text-ink-soft">
        A balloon family with the diameters {formatMm(LADDER_FROM_MM)} to {formatMm(LADDER_TO_MM)} mm in{" "}
        {formatMm(LADDER_STEP_MM)} mm steps, for you to trim to what is on your shelf. Forkwall holds no device data:
        enter the nominal and rated burst pressures from the compliance chart of the balloons you actually stock.
        Nothing is saved until you do. Several families? Add one at a time, or{" "}
        <Link href={`/labs/${slug}/stock#stock-import-heading`} className="text-brand-700 underline">
          import a CSV file
        </Link>
        .
      </p>
      <Caution demo={member.lab.isDemo} />
      <LadderForm slug={slug} />
    </div>
  );
}
