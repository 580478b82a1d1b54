import Link from "next/link";
import { redirect } from "next/navigation";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { listMyLabs } from "@/lib/ops/accounts";
import { needsVerification } from "@/lib/ops/sign-up";
import { currentUser } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata = { title: "Dashboard" };

export default async function DashboardPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=/dashboard");
  const caller = { kind: "user" as const, user };
  // An account whose address is not confirmed yet can only wait for (or ask again for) its link.
  if (await needsVerification(caller)) redirect("/check-email");
  const labs = await listMyLabs(caller);
  // An operator's first need after signing in is the lab's approved wall charts.
  const only = labs.length === 1 ? labs[0] : undefined;
  if (only?.role === "operator") redirect(`/labs/${only.slug}/wall`);
  return (
    <div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">Your labs</h1>
        <Link href="/labs/new" className={buttonClass("secondary", "py-1.5")}>
          Create a lab
        </Link>
      </div>
      {labs.length === 0 ? (
        <div className="mt-6">
          <EmptyState title="You are not in any lab yet">
            Joining a lab that uses Forkwall: ask its manager for an invitation. Setting one up:{" "}
            <Link href="/labs/new" className="text-brand-700 underline">
              create your lab
            </Link>{" "}
            and you become its manager.
          </EmptyState>
        </div>
      ) : (
        <ul className="mt-6 grid gap-4 sm:grid-cols-2">
          {labs.map((lab) => (
            <li key={lab.slug}>
              <Link
                href={lab.role === "operator" ? `/labs/${lab.slug}/wall` : `/labs/${lab.slug}`}
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
