import Link from "next/link";
import { can, type Capability, type Role } from "@/lib/permissions";

const TABS: { href: string; label: string; capability: Capability }[] = [
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
    ? [...TABS.slice(0, 2), { href: "/sign-off", label: "Sign-off", capability: "lab:read" as const }, ...TABS.slice(2)]
    : TABS;
  return (
    <nav aria-label="Lab" className="flex flex-wrap gap-1 border-b border-line">
      {tabs
        .filter((t) => can(role, t.capability))
        .map((t) => (
          <Link
            key={t.label}
            href={`/labs/${slug}${t.href}`}
            className="rounded-t-md px-3 py-2 text-sm font-medium text-ink-soft hover:bg-paper-sunk hover:text-ink"
          >
            {t.label}
          </Link>
        ))}
    </nav>
  );
}
