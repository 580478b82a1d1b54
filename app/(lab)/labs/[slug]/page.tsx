import { EmptyState } from "@/components/ui/empty-state";
import { memberForPage } from "@/lib/auth/page-guard";

export default async function LabPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}`);
  if (member === "forbidden") return null;
  return (
    <div>
      <h1 className="sr-only">{member.lab.name}: overview</h1>
      <EmptyState title="No wall charts yet">
        Charts built from this lab&apos;s stock and chosen law will be listed here, with the status of every printed copy.
      </EmptyState>
    </div>
  );
}
