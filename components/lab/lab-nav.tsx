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

/** Tabs a role may open; the pages themselves still check on the server. */
export function LabNav({ slug, role }: { slug: string; role: Role }) {
  return (
    <nav aria-label="Lab" className="flex flex-wrap gap-1 border-b border-line">
      {TABS.filter((t) => can(role, t.capability)).map((t) => (
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
