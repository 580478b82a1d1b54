import Link from "next/link";
import { can, type Capability, type Role } from "@/lib/permissions";

const TABS: { href: string; label: string; capability: Capability }[] = [
  { href: "/wall", label: "Wall charts", capability: "lab:read" },
  { href: "", label: "Overview", capability: "lab:read" },
  { href: "/charts", label: "Charts", capability: "lab:read" },
  { href: "/stock", label: "Stock", capability: "lab:read" },
  { href: "/rooms", label: "Rooms", capability: "lab:read" },
  { href: "/rules", label: "Rules", capability: "lab:read" },
  { href: "/members", label: "Members", capability: "members:manage" },
  { href: "/audit", label: "Audit log", capability: "audit:read" },
  { href: "/settings", label: "Settings", capability: "lab:read" },
];

/**
 * Tabs a role may open; the pages themselves still check on the server. Sign-off depends on the
 * lab's rules (managers approve only where granted), so the layout passes `canApprove`.
 */
export function LabNav({ slug, role, canApprove = false }: { slug: string; role: Role; canApprove?: boolean }) {
  const tabs = canApprove
    ? [...TABS.slice(0, 3), { href: "/sign-off", label: "Sign-off", capability: "lab:read" as const }, ...TABS.slice(3)]
    : TABS;
  return (
    // One row that scrolls sideways on a phone, so the page below starts on the first screen.
    <nav
      aria-label="Lab"
      className="-mx-3 flex gap-1 overflow-x-auto whitespace-nowrap border-b border-line px-3 sm:mx-0 sm:flex-wrap sm:px-0"
    >
      {tabs
        .filter((t) => can(role, t.capability))
        .map((t) => (
          <Link
            key={t.label}
            href={`/labs/${slug}${t.href}`}
            className="inline-flex min-h-11 shrink-0 items-center rounded-t-md px-3 text-sm font-medium text-ink-soft hover:bg-paper-sunk hover:text-ink"
          >
            {t.label}
          </Link>
        ))}
    </nav>
  );
}
