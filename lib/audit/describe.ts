import { isRole, ROLE_LABELS } from "@/lib/permissions";

// Turns stored audit events into words for the audit log; unknown actions (from features added
// later) fall back to their stored name rather than disappearing.
const ACTIONS: Record<string, string> = {
  "signin.succeeded": "Signed in",
  "signin.failed": "Failed sign-in",
  "signin.refused": "Sign-in refused (too many failures)",
  signout: "Signed out (every session ended)",
  "invitation.sent": "Invited a person",
  "invitation.resent": "Resent an invitation",
  "invitation.revoked": "Revoked an invitation",
  "invitation.accepted": "Accepted an invitation",
  "member.role_changed": "Changed a member's role",
  "member.removed": "Removed a member",
  "password_reset.requested": "Password reset requested",
  "password_reset.completed": "Password reset completed",
  "lab.settings_updated": "Changed the lab's settings",
  "lab.token_created": "Created a machine token",
  "lab.token_revoked": "Revoked a machine token",
};

export function describeAction(action: string): string {
  return ACTIONS[action] ?? action.replace(/[._]/g, " ");
}

const LABELS: Record<string, string> = {
  email: "E-mail",
  member: "Member",
  name: "Name",
  role: "Role",
  ip: "Client address",
  expiresAt: "Link expires",
  newAccount: "New account",
  alreadyMember: "Already a member",
};

export type DetailLine = { label: string; value?: string; before?: string; after?: string };

function show(key: string, value: unknown): string {
  if (value === null || value === undefined) return "none";
  if (key === "role" && isRole(value)) return ROLE_LABELS[value];
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string" && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value))
    return `${value.slice(0, 16).replace("T", " ")} UTC`;
  if (typeof value === "object") return JSON.stringify(value);
  return String(value);
}

const label = (key: string) =>
  LABELS[key] ??
  key
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .replace(/_/g, " ")
    .replace(/^./, (c) => c.toUpperCase());

/** Plain facts first, then one line per field that changed, as before -> after. */
export function describeDetail(detail: unknown): DetailLine[] {
  if (!detail || typeof detail !== "object" || Array.isArray(detail))
    return detail === null || detail === undefined ? [] : [{ label: "Detail", value: show("", detail) }];
  const { before, after, ...facts } = detail as Record<string, unknown>;
  const lines: DetailLine[] = Object.entries(facts).map(([k, v]) => ({ label: label(k), value: show(k, v) }));
  const b = before && typeof before === "object" ? (before as Record<string, unknown>) : {};
  const a = after && typeof after === "object" ? (after as Record<string, unknown>) : {};
  if (before !== undefined || after !== undefined) {
    for (const key of [...new Set([...Object.keys(b), ...Object.keys(a)])]) {
      lines.push({
        label: label(key),
        before: key in b ? show(key, b[key]) : "none",
        after: after === null ? "removed" : key in a ? show(key, a[key]) : "none",
      });
    }
  }
  return lines;
}
