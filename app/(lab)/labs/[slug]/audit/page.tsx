import Link from "next/link";
import { AuditFilters } from "@/components/audit/audit-filters";
import { AuditTable } from "@/components/audit/audit-table";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { FormStatus } from "@/components/ui/form-status";
import { listAudit } from "@/lib/ops/audit";
import { listMembers } from "@/lib/ops/members";
import { memberForPage } from "@/lib/auth/page-guard";
import { auditQuerySchema } from "@/lib/validation/audit";

export const metadata = { title: "Audit log" };

const PAGE_SIZE = 25;
const FILTERS = ["kind", "actor", "from", "to"] as const;

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
  const one = (k: string) => (typeof raw[k] === "string" ? raw[k] : undefined);
  const parsed = auditQuerySchema.safeParse({
    ...Object.fromEntries([...FILTERS, "before", "after"].map((k) => [k, one(k)])),
    limit: PAGE_SIZE,
  });
  const query = parsed.success ? parsed.data : { limit: PAGE_SIZE };
  const [page, people] = await Promise.all([
    listAudit(member.caller, { lab: slug }, { ...query, limit: PAGE_SIZE }),
    listMembers(member.caller, { lab: slug }),
  ]);
  // The filters ride along on every page link; paging is done by the server.
  const filters = new URLSearchParams();
  for (const k of FILTERS)
    if (parsed.success && query[k as keyof typeof query] !== undefined)
      filters.set(k, String(query[k as keyof typeof query]));
  const base = `/labs/${slug}/audit`;
  const link = (extra: Record<string, string | number>) => {
    const q = new URLSearchParams(filters);
    for (const [k, v] of Object.entries(extra)) q.set(k, String(v));
    const s = q.toString();
    return s ? `${base}?${s}` : base;
  };
  const paged = query.before !== undefined || query.after !== undefined;
  const filtered = [...filters.keys()].length > 0;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-xl font-bold">Audit log</h1>
        <p className="text-sm text-ink-faint">
          Newest first. Only this lab&apos;s events: each person&apos;s sign-ins and password changes are on their own
          account page.
        </p>
      </div>
      <AuditFilters
        action={base}
        values={parsed.success ? { kind: query.kind, actor: query.actor, from: query.from, to: query.to } : {}}
        people={people.map((p) => ({ id: p.userId, name: p.name, email: p.email }))}
        timeZone={member.lab.timeZone}
      />
      {!parsed.success ? (
        <FormStatus
          message={`That filter or page link is not valid (${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}); showing the newest entries.`}
        />
      ) : null}
      {page.events.length === 0 ? (
        <EmptyState
          title={
            filtered ? "Nothing matches these filters" : paged ? "No entries on this page" : "Nothing recorded yet"
          }
        >
          Changes to members, invitations, stock, charts, editions, rooms and the lab rules are recorded here with who
          made them and when.
        </EmptyState>
      ) : (
        <AuditTable events={page.events} timeZone={member.lab.timeZone} chartTitles={page.chartTitles} />
      )}
      <nav aria-label="Audit log pages" className="flex flex-wrap gap-3">
        {paged ? (
          <Link href={link({})} className={buttonClass("secondary")}>
            ⇤ Newest
          </Link>
        ) : null}
        {page.newerAfter !== undefined ? (
          <Link href={link({ after: page.newerAfter })} className={buttonClass("secondary")} rel="prev">
            ← Newer
          </Link>
        ) : null}
        {page.olderBefore !== undefined ? (
          <Link href={link({ before: page.olderBefore })} className={buttonClass("secondary")} rel="next">
            Older →
          </Link>
        ) : null}
      </nav>
    </div>
  );
}
