"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useState } from "react";
import { buttonClass } from "@/components/ui/button";
import { signOutAction } from "@/lib/auth/actions";
import { ROLE_LABELS, type Role } from "@/lib/permissions";

type HeaderInfo = {
  user: { name: string } | null;
  labs: { slug: string; name: string; role: Role }[];
  mailLink: boolean;
};

/** Dispatched on `window` when the signed-in person's name or labs change without a navigation. */
export const ACCOUNT_CHANGED_EVENT = "forkwall:account-changed";

/** The visitor-dependent part of the header, read from /api/v1/header after the page loads. */
export function HeaderAccount() {
  const [info, setInfo] = useState<HeaderInfo | null>(null);
  const [changes, setChanges] = useState(0);
  useEffect(() => {
    const bump = () => setChanges((n) => n + 1);
    window.addEventListener(ACCOUNT_CHANGED_EVENT, bump);
    return () => window.removeEventListener(ACCOUNT_CHANGED_EVENT, bump);
  }, []);
  // Read again on every navigation: signing in or out changes it without reloading the layout.
  const pathname = usePathname();
  useEffect(() => {
    let live = true;
    fetch("/api/v1/header", { cache: "no-store" })
      .then((res) => (res.ok ? res.json() : null))
      .then((body: HeaderInfo | null) => live && setInfo(body ?? { user: null, labs: [], mailLink: false }))
      .catch(() => live && setInfo({ user: null, labs: [], mailLink: false }));
    return () => {
      live = false;
    };
  }, [pathname, changes]);
  if (!info) return <div className="ml-auto h-8" aria-hidden />;
  const { user, labs } = info;
  return (
    <>
      <nav aria-label="Account" className="flex items-center gap-3 text-sm">
        {user ? (
          <Link href="/dashboard" className="rounded px-2 py-1 text-ink-soft hover:text-ink">
            Dashboard
          </Link>
        ) : null}
        {info.mailLink ? (
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
    </>
  );
}
