import { KIND_LABELS, RULE_LABELS, type RuleId } from "@/lib/labs/rules";
import { isRole, ROLE_LABELS } from "@/lib/permissions";
import { LAWS, type LawId } from "@/lib/sizing";

// Turns stored audit events into words for the audit log: a label for every action, a label for
// every field, values in words (never JSON), and only the fields that changed. Unknown actions
// and fields (from features added later) fall back to words made from their stored names.

/** The kinds of event the log can be filtered by, and which stored actions each covers. */
export const AUDIT_KINDS = {
  charts: { label: "Charts and editions", actions: ["chart.", "edition."] },
  stock: { label: "Stock", actions: ["stock."] },
  rooms: { label: "Rooms and copies on the wall", actions: ["room.", "posting."] },
  members: { label: "Members and invitations", actions: ["member.", "invitation."] },
  rules: { label: "Lab rules", actions: ["lab.rules_updated"] },
  settings: {
    label: "Lab settings and machine tokens",
    actions: [
      "lab.settings_updated",
      "lab.token_created",
      "lab.token_revoked",
      "lab.token_disabled",
      "lab.token_reissued",
      "lab.created",
    ],
  },
} as const;
export type AuditKind = keyof typeof AUDIT_KINDS;
export const AUDIT_KIND_IDS = Object.keys(AUDIT_KINDS) as [AuditKind, ...AuditKind[]];

const STOCK_THINGS: Record<string, string> = {
  balloon: "a balloon size",
  family: "a balloon family",
  platform: "a stent platform",
  size: "a stent size",
};
const STOCK_VERBS: Record<string, string> = { create: "Added", update: "Changed", delete: "Removed" };

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
  "member.stale_mail_on": "Turned stale-copy e-mail on",
  "member.stale_mail_off": "Turned stale-copy e-mail off",
  "password_reset.requested": "Password reset requested",
  "password_reset.completed": "Password reset completed",
  "lab.settings_updated": "Changed the lab's settings",
  "lab.token_created": "Created a machine token",
  "lab.token_revoked": "Revoked a machine token",
  "lab.token_disabled": "Disabled a machine token (its creator left or stopped managing)",
  "lab.token_reissued": "Re-issued a disabled machine token",
  "chart.created": "Created a chart",
  "chart.updated": "Changed a chart",
  "chart.logo_set": "Set a chart's logo",
  "chart.logo_removed": "Removed a chart's logo",
  "chart.archived": "Archived a chart",
  "chart.restored": "Restored an archived chart",
  "edition.created": "Submitted an edition for sign-off",
  "edition.approved": "Approved an edition",
  "edition.rejected": "Returned an edition",
  "edition.withdrawn": "Withdrew an edition",
  "edition.printed": "Downloaded an edition's PDF",
  "edition.downloaded": "Downloaded an edition's PDF",
  "edition.archive_copy": "Downloaded an archive copy of an edition",
  "posting.created": "Recorded a copy on the wall",
  "posting.removed": "Took a copy off the wall",
  "posting.restored": "Put back a copy taken down by mistake",
  "room.created": "Added a room",
  "room.renamed": "Renamed a room",
  "room.archived": "Archived a room",
  "lab.rules_updated": "Changed the lab rules",
  "stock.import": "Imported stock from a CSV file",
};

export function describeAction(action: string): string {
  const known = ACTIONS[action];
  if (known) return known;
  const stock = /^stock\.(balloon|family|platform|size)\.(create|update|delete)$/.exec(action);
  if (stock) return `${STOCK_VERBS[stock[2]!]} ${STOCK_THINGS[stock[1]!]}`;
  return action.replace(/[._]/g, " ");
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
  summary: "Change",
  number: "Edition",
  edition: "Edition",
  room: "Room",
  reason: "Reason",
  replaces: "Replaces token",
  was: "Was",
  status: "Status",
  superseded: "Replaced editions",
  reviewBy: "Review by",
  archivedAt: "Archived on",
  title: "Title",
  law: "Law",
  lookups: "Lookups",
  paper: "Paper",
  orientation: "Orientation",
  readingDistanceM: "Reading distance",
  notes: "Notes",
  roundingCaps: "Rounding caps",
  card: "Badge card",
  stentPlatformId: "Stent platform",
  inStock: "In stock",
  diameterMm: "Diameter",
  nominalMm: "Nominal diameter",
  maxPostDilatationMm: "Largest post-dilatation diameter",
  nominalAtm: "Nominal pressure",
  rbpAtm: "Rated burst pressure",
  growthAtRbpMm: "Growth at rated burst pressure",
  compliance: "Compliance",
  family: "Balloon family",
  platform: "Stent platform",
  reviewPeriodMonths: "Review period",
  managersMayApprove: "Managers may approve",
  exceptions: "Exceptions",
  laws: "Laws allowed",
  defaultLaw: "Default law",
  rounding: "Rounding",
  caps: "Largest caps",
  upMm: "Above the target",
  downMm: "Below the target",
  fileName: "File",
  rows: "Rows",
  cols: "Columns",
  ...KIND_LABELS,
};

// Bookkeeping that means nothing to a reader, or that the row already names (chart, edition, room).
const HIDDEN = new Set([
  "fingerprint",
  "revision",
  "cached",
  "chartId",
  "editionId",
  "roomId",
  "postingId",
  "familyId",
  "platformId",
  "id",
  "labId",
]);

const UNITS: Record<string, string> = {
  readingDistanceM: " m",
  diameterMm: " mm",
  nominalMm: " mm",
  maxPostDilatationMm: " mm",
  growthAtRbpMm: " mm",
  upMm: " mm",
  downMm: " mm",
  nominalAtm: " atm",
  rbpAtm: " atm",
  reviewPeriodMonths: " months",
};

const ROUNDING: Record<string, string> = {
  up: "up",
  down: "down",
  nearest: "to the nearest size",
  reach: "reach by pressure",
};

export type DetailLine = { label: string; value?: string; before?: string; after?: string };
export type DescribeContext = { chartTitles?: Record<number, string> };

const isPlain = (v: unknown): v is Record<string, unknown> => Boolean(v) && typeof v === "object" && !Array.isArray(v);

const label = (key: string) =>
  LABELS[key] ??
  key
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .replace(/_/g, " ")
    .replace(/^./, (c) => c.toUpperCase());

function lawWords(v: Record<string, unknown>): string {
  const name = LAWS[v.law as LawId]?.name ?? String(v.law);
  if (v.law === "finet" && typeof v.ratio === "number") return `${name} (ratio ${v.ratio})`;
  if (v.law === "power" && typeof v.n === "number") return `${name} (n = ${v.n})`;
  return name;
}

function axisWords(v: unknown): string {
  if (Array.isArray(v)) return `${v.join(", ")} mm`;
  if (isPlain(v)) return `${String(v.from)} to ${String(v.to)} mm in ${String(v.step)} mm steps`;
  return String(v);
}

function lookupWords(v: unknown): string {
  if (!isPlain(v)) return String(v);
  const kind = LABELS[String(v.kind)] ?? String(v.kind);
  return `${kind}: rows ${axisWords(v.rows)}, columns ${axisWords(v.cols)}, rounds ${ROUNDING[String(v.rounding)] ?? String(v.rounding)}`;
}

/** The card's sides as the designer names them: lookups counted from 1, ranges in mm. */
function cardWords(v: Record<string, unknown>): string {
  if (!Array.isArray(v.sides)) return show("", v, {});
  const range = (r: unknown, what: string) => (Array.isArray(r) ? `${what} ${r.join(" to ")} mm` : `all ${what}`);
  return v.sides
    .map((side: Record<string, unknown>, i) =>
      isPlain(side)
        ? `side ${i + 1}: lookup ${Number(side.lookup) + 1}, ${range(side.rows, "rows")}, ${range(side.cols, "columns")}`
        : String(side),
    )
    .join("; ");
}

function show(key: string, value: unknown, ctx: DescribeContext): string {
  if (value === null || value === undefined) return "none";
  if (key === "role" && isRole(value)) return ROLE_LABELS[value];
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string" && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value))
    return `${value.slice(0, 16).replace("T", " ")} UTC`;
  if (key === "compliance") return value === "nc" ? "non-compliant" : value === "sc" ? "semi-compliant" : String(value);
  if ((key === "law" || key === "defaultLaw") && isPlain(value)) return lawWords(value);
  if (key === "laws" && Array.isArray(value)) return value.map((l) => LAWS[l as LawId]?.name ?? String(l)).join(", ");
  if (key === "rounding" && Array.isArray(value)) return value.map((r) => ROUNDING[String(r)] ?? String(r)).join(", ");
  if (key === "rounding") return ROUNDING[String(value)] ?? String(value);
  if (key === "lookups" && Array.isArray(value)) return value.map(lookupWords).join("; ");
  if (key === "card" && isPlain(value)) return cardWords(value);
  if ((key === "roundingCaps" || key === "caps") && isPlain(value))
    return `${String(value.upMm)} mm above, ${String(value.downMm)} mm below`;
  if (key === "exceptions" && Array.isArray(value))
    return value.length
      ? value
          .map((e: Record<string, unknown>) => {
            const chart = ctx.chartTitles?.[Number(e.chartId)] ?? `chart ${String(e.chartId)}`;
            return `${RULE_LABELS[e.rule as RuleId] ?? String(e.rule)} for "${chart}": ${String(e.reason)}`;
          })
          .join("; ")
      : "none";
  if (key === "stentPlatformId") return `platform ${String(value)}`;
  if (Array.isArray(value)) return value.length ? value.map((x) => show("", x, ctx)).join(", ") : "none";
  if (isPlain(value))
    return Object.entries(value)
      .filter(([k]) => !HIDDEN.has(k))
      .map(([k, x]) => `${label(k)} ${show(k, x, ctx)}`)
      .join("; ");
  return `${String(value)}${UNITS[key] ?? ""}`;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** One line per field that differs; objects on both sides (not whole values) are opened up. */
function changedLines(
  b: Record<string, unknown>,
  a: Record<string, unknown> | null,
  prefix: string,
  ctx: DescribeContext,
): DetailLine[] {
  const lines: DetailLine[] = [];
  for (const key of [...new Set([...Object.keys(b), ...Object.keys(a ?? {})])]) {
    if (HIDDEN.has(key)) continue;
    const before = b[key];
    const after = a?.[key];
    if (a !== null && same(before, after)) continue;
    const name = prefix ? `${prefix} › ${label(key)}` : label(key);
    const opens =
      isPlain(before) && isPlain(after) && !["law", "defaultLaw", "roundingCaps", "caps", "card"].includes(key);
    if (opens) {
      lines.push(...changedLines(before, after, name, ctx));
      continue;
    }
    lines.push({
      label: name,
      before: key in b ? show(key, before, ctx) : "none",
      after: a === null ? "removed" : a && key in a ? show(key, after, ctx) : "none",
    });
  }
  return lines;
}

/** Plain facts first, then one line per field that changed, as before -> after. */
export function describeDetail(detail: unknown, ctx: DescribeContext = {}): DetailLine[] {
  if (!isPlain(detail))
    return detail === null || detail === undefined ? [] : [{ label: "Detail", value: show("", detail, ctx) }];
  const { before, after, ...facts } = detail;
  const lines: DetailLine[] = Object.entries(facts)
    .filter(([k]) => !HIDDEN.has(k))
    .map(([k, v]) => ({ label: label(k), value: show(k, v, ctx) }));
  if (before !== undefined || after !== undefined) {
    const b = isPlain(before) ? before : {};
    const a = after === null ? null : isPlain(after) ? after : {};
    lines.push(...changedLines(b, a, "", ctx));
  }
  return lines;
}
