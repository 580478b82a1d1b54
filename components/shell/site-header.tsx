import Link from "next/link";
import { signOutAction } from "@/lib/auth/actions";
import { listMyLabs } from "@/lib/ops/accounts";
import { sessionCaller } from "@/lib/ops/caller";
import { mailFakeConfigured } from "@/lib/mail/send";
import { ROLE_LABELS } from "@/lib/permissions";
import { buttonClass } from "@/components/ui/button";

export async function SiteHeader() {
  const caller = await sessionCaller().catch(() => null);
  const user = caller?.kind === "user" ? caller.user : null;
  const labs = caller ? await listMyLabs(caller).catch(() => []) : [];
  return (
    <header className="border-b border-line bg-paper-raised">
      <div className="mx-auto flex w-full max-w-page flex-wrap items-center gap-4 px-gutter py-3">
        <Link href="/" className="flex items-center gap-2 text-lg font-bold tracking-tight text-brand-800">
          <span
            aria-hidden
            className="inline-block h-6 w-6 rounded bg-brand-700 [clip-path:polygon(50%_0,100%_100%,62%_100%,50%_70%,38%_100%,0_100%)]"
          />
          Forkwall
        </Link>
        <nav aria-label="Main" className="flex items-center gap-3 text-sm">
          <Link href="/calculator" className="rounded px-2 py-1 text-ink-soft hover:text-ink">
            Calculator
          </Link>
          {user ? (
            <Link href="/dashboard" className="rounded px-2 py-1 text-ink-soft hover:text-ink">
              Dashboard
            </Link>
          ) : null}
          {labs.some((l) => l.role === "manager") && mailFakeConfigured() ? (
            <Link
              href="/dev/mail"
              className="rounded px-2 py-1 text-ink-soft hover:text-ink"
              title="Messages kept by the local mail fake (development only)"
            >
              Mail (local)
            </Link>
          ) : null}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          {user ? (
            <>
              {labs.length > 0 ? (
                <details className="relative">
                  <summary className="cursor-pointer list-none rounded-md border border-line px-3 py-1.5 hover:bg-paper-sunk">
                    Labs ▾
                  </summary>
                  <ul
                    className="absolute right-0 z-20 mt-1 w-72 rounded-md border border-line bg-white py-1 shadow-lg"
                    aria-label="Switch lab"
                  >
                    {labs.map((lab) => (
                      <li key={lab.slug}>
                        <Link href={`/labs/${lab.slug}`} className="block px-3 py-2 hover:bg-paper-sunk">
                          <span className="block font-medium">{lab.name}</span>
                          <span className="text-xs text-ink-faint">{ROLE_LABELS[lab.role]}</span>
                        </Link>
                      </li>
                    ))}
                  </ul>
                </details>
              ) : null}
              <Link
                href="/account"
                className="hidden text-ink-soft underline-offset-2 hover:underline sm:inline"
                data-testid="signed-in-as"
                title="Your account"
              >
                {user.name}
              </Link>
              <form action={signOutAction}>
                <button type="submit" className={buttonClass("secondary", "py-1.5")}>
                  Sign out
                </button>
              </form>
            </>
          ) : (
            <Link href="/sign-in" className={buttonClass("primary", "py-1.5")}>
              Sign in
            </Link>
          )}
        </div>
      </div>
    </header>
  );
}
