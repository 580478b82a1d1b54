import Link from "next/link";
import { AuditTable } from "@/components/audit/audit-table";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { FormStatus } from "@/components/ui/form-status";
import { listAudit } from "@/lib/ops/audit";
import { memberForPage } from "@/lib/auth/page-guard";
import { auditQuerySchema } from "@/lib/validation/audit";

export const metadata = { title: "Audit log" };

const PAGE_SIZE = 25;

export default async function AuditPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { slug } = await params;
  const member = await memberForPage(slug, "audit:read", `/labs/${slug}/audit`);
  if (member === "forbidden") return <Forbidden what="read the audit log" slug={slug} />;
  const raw = await searchParams;
  const parsed = auditQuerySchema.safeParse({ before: raw.before, after: raw.after, limit: PAGE_SIZE });
  const query = parsed.success ? parsed.data : { before: undefined, after: undefined, limit: PAGE_SIZE };
  const page = await listAudit(member.caller, { lab: slug }, { ...query, limit: PAGE_SIZE });
  const base = `/labs/${slug}/audit`;
  const paged = query.before !== undefined || query.after !== undefined;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-xl font-bold">Audit log</h1>
        <p className="text-sm text-ink-faint">
          Newest first. Includes sign-ins and password resets of the lab&apos;s current members.
        </p>
      </div>
      {!parsed.success ? <FormStatus message="That page link is not valid; showing the newest entries." /> : null}
      {page.events.length === 0 ? (
        <EmptyState title={paged ? "No entries on this page" : "Nothing recorded yet"}>
          Changes to members, invitations, stock and charts are recorded here with who made them and when.
        </EmptyState>
      ) : (
        <AuditTable events={page.events} timeZone={member.lab.timeZone} />
      )}
      <nav aria-label="Audit log pages" className="flex flex-wrap gap-3">
        {paged ? (
          <Link href={base} className={buttonClass("secondary")}>
            ⇤ Newest
          </Link>
        ) : null}
        {page.newerAfter !== undefined ? (
          <Link href={`${base}?after=${page.newerAfter}`} className={buttonClass("secondary")} rel="prev">
            ← Newer
          </Link>
        ) : null}
        {page.olderBefore !== undefined ? (
          <Link href={`${base}?before=${page.olderBefore}`} className={buttonClass("secondary")} rel="next">
            Older →
          </Link>
        ) : null}
      </nav>
    </div>
  );
}
