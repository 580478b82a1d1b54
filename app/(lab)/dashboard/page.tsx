import Link from "next/link";
import { redirect } from "next/navigation";
import { EmptyState } from "@/components/ui/empty-state";
import { listMyLabs } from "@/lib/ops/accounts";
import { currentUser } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata = { title: "Dashboard" };

export default async function DashboardPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=/dashboard");
  const labs = await listMyLabs({ kind: "user", user });
  return (
    <div>
      <h1 className="text-2xl font-bold">Your labs</h1>
      {labs.length === 0 ? (
        <div className="mt-6">
          <EmptyState title="You are not in any lab yet">
            Ask your lab&apos;s manager for an invitation. Once you join, its charts, stock and rooms appear here.
          </EmptyState>
        </div>
      ) : (
        <ul className="mt-6 grid gap-4 sm:grid-cols-2">
          {labs.map((lab) => (
            <li key={lab.slug}>
              <Link
                href={`/labs/${lab.slug}`}
                className="block rounded-card border border-line bg-paper-raised p-5 hover:border-brand-500"
              >
                <span className="block text-lg font-semibold">{lab.name}</span>
                <span className="text-sm text-ink-faint">Your role: {ROLE_LABELS[lab.role]}</span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
