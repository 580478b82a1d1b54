import Link from "next/link";
import { redirect } from "next/navigation";
import { EmailForm, LeaveLabButton, NameForm, PasswordForm } from "@/components/account/account-forms";
import { formatDateTime } from "@/lib/format/dates";
import { readAccount } from "@/lib/ops/account-settings";
import { sessionCaller } from "@/lib/ops/caller";
import { needsVerification } from "@/lib/ops/sign-up";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata = { title: "Your account" };

const section = "rounded-card border border-line bg-paper-raised p-5";

export default async function AccountPage() {
  const caller = await sessionCaller();
  if (caller.kind !== "user") redirect("/sign-in?callbackUrl=/account");
  if (await needsVerification(caller)) redirect("/check-email");
  const account = await readAccount(caller);
  return (
    <div className="max-w-2xl space-y-6">
      <h1 className="text-2xl font-bold">Your account</h1>
      <section aria-labelledby="name-h" className={section}>
        <h2 id="name-h" className="mb-3 text-lg font-semibold">
          Name
        </h2>
        <NameForm name={account.name} />
      </section>
      <section aria-labelledby="email-h" className={section}>
        <h2 id="email-h" className="mb-3 text-lg font-semibold">
          E-mail address
        </h2>
        {account.pendingEmail ? (
          <p className="mb-3 text-sm" data-testid="pending-email">
            Waiting for confirmation: <strong>{account.pendingEmail.email}</strong> (open the link sent there).
          </p>
        ) : null}
        <EmailForm email={account.email} />
      </section>
      <section aria-labelledby="password-h" className={section}>
        <h2 id="password-h" className="mb-3 text-lg font-semibold">
          Password
        </h2>
        <PasswordForm />
      </section>
      <section aria-labelledby="labs-h" className={section}>
        <h2 id="labs-h" className="mb-3 text-lg font-semibold">
          Your labs
        </h2>
        {account.labs.length === 0 ? (
          <p className="text-ink-soft">
            You are not in any lab.{" "}
            <Link href="/labs/new" className="text-brand-700 underline">
              Create one
            </Link>
            .
          </p>
        ) : (
          <ul className="divide-y divide-line">
            {account.labs.map((lab) => (
              <li
                key={lab.slug}
                className="flex flex-wrap items-start justify-between gap-3 py-3"
                data-testid={`lab-${lab.slug}`}
              >
                <div>
                  <Link href={`/labs/${lab.slug}`} className="font-medium text-brand-700 underline">
                    {lab.name}
                  </Link>
                  <span className="block text-sm text-ink-faint">{ROLE_LABELS[lab.role]}</span>
                </div>
                <LeaveLabButton slug={lab.slug} name={lab.name} />
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="activity-h" className={section}>
        <h2 id="activity-h" className="mb-1 text-lg font-semibold">
          Recent account activity
        </h2>
        <p className="mb-3 text-sm text-ink-soft">
          Sign-ins, password and e-mail changes of this account (newest first, times in UTC). They appear in no
          lab&apos;s audit log.
        </p>
        {account.activity.length === 0 ? (
          <p className="text-ink-soft">Nothing recorded yet.</p>
        ) : (
          <ul className="divide-y divide-line text-sm" data-testid="account-activity">
            {account.activity.map((e) => (
              <li key={e.id} className="flex flex-wrap gap-x-3 py-2">
                <time dateTime={e.at.toISOString()} className="text-ink-faint tabular-nums">
                  {formatDateTime(e.at, "UTC")}
                </time>
                <span>{e.what}</span>
                {e.from ? <span className="text-ink-faint">from {e.from}</span> : null}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
