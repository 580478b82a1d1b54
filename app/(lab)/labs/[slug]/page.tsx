import { EmptyState } from "@/components/ui/empty-state";
import { memberForPage } from "@/lib/auth/page-guard";
import { ROLE_LABELS } from "@/lib/permissions";

export default async function LabPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}`);
  if (member === "forbidden") return null;
  return (
    <div>
      <p className="text-sm text-ink-faint">Your role: {ROLE_LABELS[member.role]}</p>
      <h1 className="text-2xl font-bold">{member.lab.name}</h1>
      <div className="mt-6">
        <EmptyState title="No wall charts yet">
          Charts built from this lab&apos;s stock and chosen law will be listed here, with the status of every printed copy.
        </EmptyState>
      </div>
    </div>
  );
}
