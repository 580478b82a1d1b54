import { LabNav } from "@/components/lab/lab-nav";
import { memberForPage } from "@/lib/auth/page-guard";
import { labCan } from "@/lib/ops/access";
import { ROLE_LABELS } from "@/lib/permissions";

export default async function LabLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ slug: string }>;
}) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}`);
  if (member === "forbidden") return children;
  return (
    <div>
      <p className="mb-2 text-base">
        <span className="font-bold">{member.lab.name}</span>{" "}
        <span className="text-ink-faint">· Your role: {ROLE_LABELS[member.role]}</span>
      </p>
      <LabNav slug={slug} role={member.role} canApprove={await labCan(member.lab.id, member.role, "edition:approve")} />
      <div className="pt-3 sm:pt-6">{children}</div>
    </div>
  );
}
