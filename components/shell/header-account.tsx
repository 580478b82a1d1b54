"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import { buttonClass } from "@/components/ui/button";
import { signOutAction } from "@/lib/auth/actions";
import { ROLE_LABELS, type Role } from "@/lib/permissions";
import { forgetOfflinePages } from "@/components/offline/service-worker";
import { useDismiss } from "./use-dismiss";

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
      .then((body: HeaderInfo | null) => {
        // Answered, and nobody is signed in: kept lab pages leave the device.
        if (body && !body.user) forgetOfflinePages();
        if (live) setInfo(body ?? { user: null, labs: [], mailLink: false });
      })
      .catch(() => live && setInfo({ user: null, labs: [], mailLink: false }));
    return () => {
      live = false;
    };
  }, [pathname, changes]);
  const { user, labs } = info ?? { user: null, labs: [] };
  const links = [
    { href: "/calculator", label: "Calculator" },
    ...(user ? [{ href: "/dashboard", label: "Dashboard" }] : []),
    ...(info?.mailLink ? [{ href: "/dev/mail", label: "Mail (local)" }] : []),
  ];
  return (
    <>
      <nav aria-label="Main" className="hidden items-center gap-1 text-sm sm:flex">
        {links.map((l) => (
          <Link key={l.href} href={l.href} className={LINK}>
            {l.label}
          </Link>
        ))}
      </nav>
      <div className="ml-auto flex items-center gap-2 text-sm">
        {user ? (
          <div className="hidden items-center gap-2 sm:flex">
            {labs.length > 0 ? <LabsMenu labs={labs} /> : null}
            <Link href="/account" className={LINK} data-testid="signed-in-as" title="Your account">
              {user.name}
            </Link>
            <SignOut />
          </div>
        ) : info ? (
          <Link href="/sign-in" className={buttonClass("primary", "py-1.5")}>
            Sign in
          </Link>
        ) : null}
        <PhoneMenu links={links} labs={labs} signedIn={Boolean(user)} userName={user?.name ?? null} />
      </div>
    </>
  );
}

const LINK = "inline-flex min-h-11 items-center rounded px-2 text-ink-soft hover:text-ink";

function SignOut() {
  return (
    <form action={signOutAction}>
      <button type="submit" className={buttonClass("secondary", "py-1.5")}>
        Sign out
      </button>
    </form>
  );
}

type Lab = HeaderInfo["labs"][number];

function useMenu() {
  // Open on the page where it was opened: a navigation closes it.
  const pathname = usePathname();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const ref = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const close = useCallback((refocus: boolean) => {
    setOpenOn(null);
    if (refocus) button.current?.focus();
  }, []);
  useDismiss(ref, open, close);
  const toggle = () => setOpenOn(open ? null : pathname);
  return [open, toggle, ref, button] as const;
}

function LabLinks({ labs }: { labs: Lab[] }) {
  return labs.map((lab) => (
    <li key={lab.slug}>
      <Link href={`/labs/${lab.slug}`} className="block min-h-11 px-3 py-2 hover:bg-paper-sunk">
        <span className="block font-medium">{lab.name}</span>
        <span className="text-xs text-ink-faint">{ROLE_LABELS[lab.role]}</span>
      </Link>
    </li>
  ));
}

/** The labs list on wide screens: a button and a list that closes on an outside tap or Escape. */
function LabsMenu({ labs }: { labs: Lab[] }) {
  const [open, toggle, ref, button] = useMenu();
  return (
    <div ref={ref} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        onClick={toggle}
        className="inline-flex min-h-11 items-center rounded-md border border-line px-3 hover:bg-paper-sunk"
      >
        Labs ▾
      </button>
      {open ? (
        <ul
          className="absolute right-0 z-30 mt-1 w-72 max-w-[calc(100vw-1.5rem)] rounded-md border border-line bg-white py-1 shadow-lg"
          aria-label="Switch lab"
        >
          <LabLinks labs={labs} />
        </ul>
      ) : null}
    </div>
  );
}

/** Phones: everything behind one button, in a panel as wide as the header (so never off screen). */
function PhoneMenu({
  links,
  labs,
  signedIn,
  userName,
}: {
  links: { href: string; label: string }[];
  labs: Lab[];
  signedIn: boolean;
  userName: string | null;
}) {
  const [open, toggle, ref, button] = useMenu();
  return (
    <div ref={ref} className="sm:hidden">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls="phone-menu"
        onClick={toggle}
        className="inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border border-line px-3 font-semibold"
      >
        Menu
      </button>
      {open ? (
        <div
          id="phone-menu"
          data-testid="phone-menu"
          className="absolute inset-x-0 top-full z-30 border-b border-line bg-white px-3 pb-3 shadow-lg"
        >
          <nav aria-label="Menu">
            <ul>
              {links.map((l) => (
                <li key={l.href}>
                  <Link href={l.href} className="flex min-h-11 items-center px-3">
                    {l.label}
                  </Link>
                </li>
              ))}
            </ul>
            {labs.length ? (
              <ul aria-label="Your labs" className="border-t border-line">
                <LabLinks labs={labs} />
              </ul>
            ) : null}
          </nav>
          {signedIn ? (
            <div className="mt-2 flex items-center justify-between gap-2 border-t border-line pt-2">
              <Link href="/account" className="flex min-h-11 min-w-0 items-center truncate px-3">
                {userName}
              </Link>
              <SignOut />
            </div>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
