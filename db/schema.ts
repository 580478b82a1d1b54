import {
  bigint,
  boolean,
  char,
  customType,
  datetime,
  decimal,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  text,
  tinyint,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { sql } from "drizzle-orm";
import { ROLES } from "../lib/permissions";
import { EDITION_STATUSES } from "../lib/editions/states";

// MySQL has no RETURNING and drizzle's serial() emits SQL MariaDB rejects: one id shape everywhere.
const id = () => bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey();
const ref = (name: string) => bigint(name, { mode: "number", unsigned: true });
const createdAt = () =>
  datetime("created_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);
const when = (name: string) => datetime(name, { mode: "date", fsp: 3 });
const mm = (name: string) => decimal(name, { precision: 5, scale: 2, mode: "number" });
const atm = (name: string) => decimal(name, { precision: 4, scale: 1, mode: "number" });

// MariaDB stores JSON as LONGTEXT and sends it as text: parse it on the way out.
const jsonText = <T>(name: string) =>
  customType<{ data: T; driverData: string }>({
    dataType: () => "json",
    toDriver: (value) => JSON.stringify(value),
    fromDriver: (value) => (typeof value === "string" ? JSON.parse(value) : value) as T,
  })(name);

/** ASCII text compared byte for byte: codes and tokens whose letter case carries entropy. */
const asciiBin = (name: string, length: number, kind: "char" | "varchar") =>
  customType<{ data: string; driverData: string }>({
    dataType: () => `${kind}(${length}) CHARACTER SET ascii COLLATE ascii_bin`,
  })(name);

const mediumBlob = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "mediumblob",
});

// ---------- people and labs ----------

export const users = mysqlTable("users", {
  id: id(),
  email: varchar("email", { length: 254 }).notNull().unique(),
  name: varchar("name", { length: 120 }).notNull(),
  passwordHash: varchar("password_hash", { length: 100 }).notNull(),
  // Signed session cookies carry the version they were issued under; a password reset, a
  // sign-out, or removal from a lab bumps it, and every request compares (lib/auth/session.ts).
  sessionVersion: int("session_version").notNull().default(0),
  // When the address was proven. Only a self sign-up starts without it (NULL until its link is
  // used); accounts created by accepting an invitation (the link proved the address), by the
  // seed, or before sign-up existed take the time they were written.
  emailVerifiedAt: datetime("email_verified_at", { mode: "date", fsp: 3 }).default(sql`CURRENT_TIMESTAMP(3)`),
  createdAt: createdAt(),
});

export const labs = mysqlTable("labs", {
  id: id(),
  slug: varchar("slug", { length: 64 }).notNull().unique(),
  name: varchar("name", { length: 160 }).notNull(),
  stockRevision: int("stock_revision").notNull().default(0),
  /** Demo labs print the "invented and illustrative" clause in their caution. */
  isDemo: boolean("is_demo").notNull().default(false),
  /** IANA time zone every date on pages, posters and mail is shown in (lib/format). */
  timeZone: varchar("time_zone", { length: 64 }).notNull().default("UTC"),
  /** Decimal separator printed on posters: "point" (3.25) or "comma" (3,25). */
  numberFormat: mysqlEnum("number_format", ["point", "comma"]).notNull().default("point"),
  /** Whom to ask, shown on the check page ("ask the charge nurse in the control room"). */
  contactLine: varchar("contact_line", { length: 200 }),
  createdAt: createdAt(),
});

/** The lab's own rules (lib/labs/rules.ts), owned by its medical lead; a lab without a row has the defaults. */
export const labRules = mysqlTable("lab_rules", {
  labId: ref("lab_id")
    .primaryKey()
    .references(() => labs.id, { onDelete: "cascade" }),
  rules: jsonText<unknown>("rules").notNull(),
  // Bumped by every change; a change made against an older revision is refused (409).
  revision: int("revision").notNull().default(0),
  updatedBy: ref("updated_by").references(() => users.id, { onDelete: "set null" }),
  updatedAt: when("updated_at").notNull(),
});

export const memberships = mysqlTable(
  "memberships",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: mysqlEnum("role", ROLES).notNull(),
    notifyStale: boolean("notify_stale").notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("memberships_lab_user_uq").on(t.labId, t.userId), index("memberships_user_idx").on(t.userId)],
);

export const invitations = mysqlTable(
  "invitations",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    email: varchar("email", { length: 254 }).notNull(),
    role: mysqlEnum("role", ROLES).notNull(),
    tokenHash: char("token_hash", { length: 64 }).notNull().unique(),
    invitedBy: ref("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: when("expires_at").notNull(),
    lastSentAt: when("last_sent_at").notNull(),
    acceptedAt: when("accepted_at"),
    revokedAt: when("revoked_at"),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_lab_idx").on(t.labId, t.email)],
);

export const passwordResets = mysqlTable(
  "password_resets",
  {
    id: id(),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: char("token_hash", { length: 64 }).notNull().unique(),
    expiresAt: when("expires_at").notNull(),
    usedAt: when("used_at"),
    createdAt: createdAt(),
  },
  (t) => [index("password_resets_user_idx").on(t.userId)],
);

/**
 * Machine tokens a lab's manager creates for its inventory system (lib/auth/machine-tokens.ts):
 * only the SHA-256 of the token is stored; revoked tokens stay so the audit log keeps their name.
 */
export const labTokens = mysqlTable(
  "lab_tokens",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 80 }).notNull(),
    tokenHash: char("token_hash", { length: 64 }).notNull().unique(),
    /** The first characters of the token (prefix included), so a person can tell tokens apart. */
    hint: varchar("hint", { length: 16 }).notNull(),
    scopes: jsonText<string[]>("scopes").notNull(),
    createdBy: ref("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    lastUsedAt: when("last_used_at"),
    revokedAt: when("revoked_at"),
    revokedBy: ref("revoked_by").references(() => users.id, { onDelete: "set null" }),
    /** Set when its creator left the lab or stopped being a manager: refused (401) until re-issued. */
    disabledAt: when("disabled_at"),
    disabledReason: varchar("disabled_reason", { length: 200 }),
  },
  (t) => [index("lab_tokens_lab_idx").on(t.labId)],
);

/** Links that prove an address: a new account's, or the new address of an e-mail change. */
export const emailVerifications = mysqlTable(
  "email_verifications",
  {
    id: id(),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    /** The address the link was sent to; differs from users.email for an e-mail change. */
    email: varchar("email", { length: 254 }).notNull(),
    tokenHash: char("token_hash", { length: 64 }).notNull().unique(),
    expiresAt: when("expires_at").notNull(),
    usedAt: when("used_at"),
    /** Set when a password change, reset or e-mail change ends the link before it was used. */
    revokedAt: when("revoked_at"),
    createdAt: createdAt(),
  },
  (t) => [index("email_verifications_user_idx").on(t.userId)],
);

export const auditEvents = mysqlTable(
  "audit_events",
  {
    id: id(),
    labId: ref("lab_id").references(() => labs.id, { onDelete: "cascade" }),
    actorUserId: ref("actor_user_id").references(() => users.id, { onDelete: "set null" }),
    /** Set instead of actor_user_id when a machine token made the change (shown as "token <name>"). */
    actorTokenId: ref("actor_token_id").references(() => labTokens.id, { onDelete: "set null" }),
    action: varchar("action", { length: 64 }).notNull(),
    targetType: varchar("target_type", { length: 32 }),
    targetId: varchar("target_id", { length: 64 }),
    detail: jsonText<unknown>("detail"),
    createdAt: createdAt(),
  },
  (t) => [
    index("audit_events_lab_idx").on(t.labId, t.createdAt),
    index("audit_events_action_idx").on(t.action),
    // A person's own account events (the account page).
    index("audit_events_target_idx").on(t.targetType, t.targetId),
  ],
);

// Shape expected by rate-limiter-flexible's MySQL store (created here so migrations own it).
export const rateLimits = mysqlTable("rate_limits", {
  key: varchar("key", { length: 255 }).primaryKey(),
  points: int("points").notNull().default(0),
  expire: bigint("expire", { mode: "number", unsigned: true }),
});

// ---------- stock ----------

export const balloonFamilies = mysqlTable(
  "balloon_families",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    compliance: mysqlEnum("compliance", ["nc", "sc"]).notNull(),
    nominalAtm: atm("nominal_atm").notNull(),
    rbpAtm: atm("rbp_atm").notNull(),
    growthAtRbpMm: mm("growth_at_rbp_mm"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("balloon_families_lab_name_uq").on(t.labId, t.name)],
);

export const balloons = mysqlTable(
  "balloons",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    familyId: ref("family_id")
      .notNull()
      .references(() => balloonFamilies.id, { onDelete: "cascade" }),
    diameterMm: mm("diameter_mm").notNull(),
    inStock: boolean("in_stock").notNull().default(true),
  },
  (t) => [
    uniqueIndex("balloons_family_diameter_uq").on(t.familyId, t.diameterMm),
    index("balloons_lab_idx").on(t.labId),
  ],
);

export const stentPlatforms = mysqlTable(
  "stent_platforms",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("stent_platforms_lab_name_uq").on(t.labId, t.name)],
);

export const stentSizes = mysqlTable(
  "stent_sizes",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    platformId: ref("platform_id")
      .notNull()
      .references(() => stentPlatforms.id, { onDelete: "cascade" }),
    nominalMm: mm("nominal_mm").notNull(),
    maxPostDilatationMm: mm("max_post_dilatation_mm").notNull(),
  },
  (t) => [
    uniqueIndex("stent_sizes_platform_nominal_uq").on(t.platformId, t.nominalMm),
    index("stent_sizes_lab_idx").on(t.labId),
  ],
);

// ---------- charts and editions ----------

export const logos = mysqlTable(
  "logos",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    sha256: char("sha256", { length: 64 }).notNull(),
    mime: varchar("mime", { length: 32 }).notNull(),
    bytes: mediumBlob("bytes").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("logos_lab_sha_uq").on(t.labId, t.sha256)],
);

export const charts = mysqlTable(
  "charts",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    title: varchar("title", { length: 160 }).notNull(),
    // The full design (lookups, law, paper, texts...) validated by lib/validation/chart.ts.
    definition: jsonText<unknown>("definition").notNull(),
    logoId: ref("logo_id").references(() => logos.id, { onDelete: "set null" }),
    // What an edition made now would freeze: recomputed in the same transaction as any change.
    liveFingerprint: char("live_fingerprint", { length: 64 }),
    liveSnapshot: jsonText<unknown>("live_snapshot"),
    liveChangedAt: when("live_changed_at"),
    createdBy: ref("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: when("updated_at"),
    /** An archived chart leaves the lists and keeps its editions; its posted copies read take-down. */
    archivedAt: when("archived_at"),
  },
  (t) => [index("charts_lab_idx").on(t.labId)],
);

export const editions = mysqlTable(
  "editions",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    chartId: ref("chart_id")
      .notNull()
      .references(() => charts.id, { onDelete: "restrict" }),
    number: int("number").notNull(),
    status: mysqlEnum("status", EDITION_STATUSES).notNull().default("draft"),
    snapshot: jsonText<unknown>("snapshot").notNull(),
    fingerprint: char("fingerprint", { length: 64 }).notNull(),
    checkToken: asciiBin("check_token", 64, "varchar").notNull().unique(),
    /** Typable code printed under the QR (lib/editions/short-code.ts); `/c/<code>` leads to the check page. */
    shortCode: asciiBin("short_code", 8, "char").notNull().unique(),
    createdBy: ref("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    approvedBy: ref("approved_by").references(() => users.id, { onDelete: "set null" }),
    approvedByName: varchar("approved_by_name", { length: 120 }),
    approvedAt: when("approved_at"),
    rejectedBy: ref("rejected_by").references(() => users.id, { onDelete: "set null" }),
    rejectedAt: when("rejected_at"),
    rejectionReason: text("rejection_reason"),
    supersededAt: when("superseded_at"),
    withdrawnBy: ref("withdrawn_by").references(() => users.id, { onDelete: "set null" }),
    withdrawnAt: when("withdrawn_at"),
    withdrawalReason: text("withdrawal_reason"),
    /** The approved edition this one superseded when it was approved; kept with the approval. */
    replacesId: ref("replaces_id"),
    /** Set at approval from the lab's review period: after it the copy is due for review. */
    reviewBy: when("review_by"),
  },
  (t) => [
    uniqueIndex("editions_chart_number_uq").on(t.chartId, t.number),
    index("editions_lab_status_idx").on(t.labId, t.status),
  ],
);

export const posterRenders = mysqlTable(
  "poster_renders",
  {
    id: id(),
    editionId: ref("edition_id")
      .notNull()
      .references(() => editions.id, { onDelete: "cascade" }),
    renderKey: char("render_key", { length: 64 }).notNull().unique(),
    pdf: mediumBlob("pdf").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("poster_renders_edition_idx").on(t.editionId)],
);

// ---------- rooms, postings, notices ----------

export const rooms = mysqlTable(
  "rooms",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    createdAt: createdAt(),
    archivedAt: when("archived_at"),
  },
  (t) => [uniqueIndex("rooms_lab_name_uq").on(t.labId, t.name)],
);

export const postings = mysqlTable(
  "postings",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    editionId: ref("edition_id")
      .notNull()
      .references(() => editions.id, { onDelete: "cascade" }),
    roomId: ref("room_id")
      .notNull()
      .references(() => rooms.id, { onDelete: "cascade" }),
    postedBy: ref("posted_by").references(() => users.id, { onDelete: "set null" }),
    postedAt: createdAt(),
    removedBy: ref("removed_by").references(() => users.id, { onDelete: "set null" }),
    removedAt: when("removed_at"),
    // The status last seen by the stale-copy pass, so each change to it is noticed once.
    lastStatus: mysqlEnum("last_status", ["current", "outdated", "superseded", "withdrawn", "draft"])
      .notNull()
      .default("current"),
    // 1 while the copy hangs, NULL once taken down: with the unique key below the database
    // holds at most one hanging copy of an edition per room (NULLs never collide).
    hanging: tinyint("hanging").generatedAlwaysAs(sql`(case when \`removed_at\` is null then 1 else null end)`, {
      mode: "stored",
    }),
  },
  (t) => [
    index("postings_lab_idx").on(t.labId, t.removedAt),
    index("postings_edition_idx").on(t.editionId),
    uniqueIndex("postings_one_hanging_uq").on(t.editionId, t.roomId, t.hanging),
  ],
);

// One row per change that made posted copies stale: its unique key stops a second e-mail.
export const staleNotices = mysqlTable(
  "stale_notices",
  {
    id: id(),
    labId: ref("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    changeKey: varchar("change_key", { length: 128 }).notNull(),
    detail: jsonText<unknown>("detail"),
    createdAt: createdAt(),
    sentAt: when("sent_at"),
  },
  (t) => [uniqueIndex("stale_notices_lab_change_uq").on(t.labId, t.changeKey)],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Lab = typeof labs.$inferSelect;
export type NewLab = typeof labs.$inferInsert;
export type Membership = typeof memberships.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type BalloonFamily = typeof balloonFamilies.$inferSelect;
export type NewBalloonFamily = typeof balloonFamilies.$inferInsert;
export type Balloon = typeof balloons.$inferSelect;
export type StentPlatform = typeof stentPlatforms.$inferSelect;
export type StentSize = typeof stentSizes.$inferSelect;
export type Chart = typeof charts.$inferSelect;
export type NewChart = typeof charts.$inferInsert;
export type Edition = typeof editions.$inferSelect;
export type Room = typeof rooms.$inferSelect;
export type Posting = typeof postings.$inferSelect;
