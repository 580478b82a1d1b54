import "server-only";
import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, STALE, type CheckStatus } from "@/lib/editions/check";
import type { StaleItem, StaleNotice } from "@/lib/editions/stale";
import { db } from "../index";
import { charts, editions, labs, memberships, postings, staleNotices, users } from "../schema";
import type { Tx } from "./audit";
import { readPostings } from "./postings-read";

/**
 * Inside the transaction of a change, after the lab's live snapshots were refreshed: works out
 * every hanging copy's status, stores it, and when copies newly went stale records ONE notice
 * for this change (its key is unique per lab, so a change never mails twice). `cleared`: the
 * change itself ended a stale copy (it was taken down), so an all-clear is due if none is left.
 */
export async function reconcilePostings(
  tx: Tx,
  {
    labId,
    changeKey,
    cause,
    cleared: clearedByChange = false,
  }: { labId: number; changeKey: string; cause: string; cleared?: boolean },
) {
  const newlyStale: StaleItem[] = [];
  const copies = await readPostings(tx, labId);
  let cleared = clearedByChange;
  for (const copy of copies) {
    if (copy.status === copy.lastStatus) continue;
    if (STALE.includes(copy.lastStatus) && !STALE.includes(copy.status)) cleared = true;
    await tx
      .update(postings)
      .set({ lastStatus: copy.status })
      .where(and(eq(postings.id, copy.postingId), eq(postings.labId, labId)));
    if (STALE.includes(copy.status) && !STALE.includes(copy.lastStatus)) {
      newlyStale.push({
        room: copy.room,
        chartId: copy.chart.id,
        chartTitle: copy.chart.title,
        editionNumber: copy.edition.number,
        status: copy.status as StaleItem["status"],
        changes: copy.changes,
        current: copy.current ? { editionId: copy.current.id, number: copy.current.number } : null,
      });
    }
  }
  // Every copy current again after some were stale: an all-clear, sent like a digest.
  const allClear = cleared && !newlyStale.length && !copies.some((c) => STALE.includes(c.status));
  if (newlyStale.length || allClear) {
    const [lab] = await tx.select({ name: labs.name, slug: labs.slug }).from(labs).where(eq(labs.id, labId));
    const detail: StaleNotice = {
      kind: allClear ? "all-clear" : "stale",
      labName: lab!.name,
      labSlug: lab!.slug,
      cause,
      items: newlyStale,
    };
    const key = allClear ? `${changeKey}:all-clear` : changeKey;
    await tx
      .insert(staleNotices)
      .values({ labId, changeKey: key, detail })
      .onDuplicateKeyUpdate({ set: { changeKey: key } });
  }
  return newlyStale;
}

/** Status a new posting starts from, so hanging an already stale copy does not mail anyone. */
export async function initialPostingStatus(
  tx: Tx,
  { labId, editionId }: { labId: number; editionId: number },
): Promise<CheckStatus> {
  const [r] = await tx
    .select({
      edition: editions,
      chart: { liveFingerprint: charts.liveFingerprint, liveSnapshot: charts.liveSnapshot },
    })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  if (!r) return "current";
  return checkEdition(
    { ...r.edition, snapshot: r.edition.snapshot as Snapshot },
    { liveFingerprint: r.chart.liveFingerprint, liveSnapshot: r.chart.liveSnapshot as Snapshot | null },
    null,
  ).status;
}

/** Labs with stale-copy notices that have not gone out (for the timer that wakes after the quiet period). */
export async function listLabsWithPendingNotices(): Promise<number[]> {
  const rows = await db
    .selectDistinct({ labId: staleNotices.labId })
    .from(staleNotices)
    .where(isNull(staleNotices.sentAt));
  return rows.map((r) => r.labId);
}

export type DigestOutcome = "digest" | "all-clear" | "quiet";

/**
 * Claims a lab's unsent notices as one digest once the lab has been quiet: no new notice for
 * `quietSeconds` (or the oldest waiting four quiet periods, so a lab that never stops changing
 * still hears). Inside the caller's transaction: the rows are locked, and a second instance (or a
 * Galera node that lost the race at commit and ran again) finds them claimed. Ages are measured
 * on the database's clock, which every instance shares.
 *
 * The outcome says what to mail, from the wall as it is now: `digest` while copies are stale;
 * `all-clear` when none is stale and the last e-mail was a digest; `quiet` when none is stale and
 * nobody was told otherwise (a change undone within the quiet period mails nothing). It is
 * stored on the rows, so the next claim knows what was last said.
 */
export async function claimDueNotices(
  tx: Tx,
  { labId, quietSeconds }: { labId: number; quietSeconds: number },
): Promise<{ ids: number[]; notices: StaleNotice[]; outcome: DigestOutcome; items: StaleItem[] } | null> {
  const rows = await tx
    .select({
      id: staleNotices.id,
      detail: staleNotices.detail,
      ageMs: sql<number>`TIMESTAMPDIFF(MICROSECOND, ${staleNotices.createdAt}, UTC_TIMESTAMP(3)) / 1000`,
    })
    .from(staleNotices)
    .where(and(eq(staleNotices.labId, labId), isNull(staleNotices.sentAt)))
    .orderBy(asc(staleNotices.id))
    .for("update");
  if (!rows.length) return null;
  const ages = rows.map((r) => Number(r.ageMs));
  const quietMs = quietSeconds * 1000;
  if (Math.min(...ages) < quietMs && Math.max(...ages) < 4 * quietMs) return null;
  const items = staleItems(await readPostings(tx, labId));
  let outcome: DigestOutcome = "digest";
  if (!items.length) {
    const [said] = await tx
      .select({ outcome: sql<string>`JSON_VALUE(${staleNotices.detail}, '$.outcome')` })
      .from(staleNotices)
      .where(
        and(
          eq(staleNotices.labId, labId),
          isNotNull(staleNotices.sentAt),
          sql`JSON_VALUE(${staleNotices.detail}, '$.outcome') IN ('digest', 'all-clear')`,
        ),
      )
      .orderBy(desc(staleNotices.id))
      .limit(1);
    outcome = said?.outcome === "digest" ? "all-clear" : "quiet";
  }
  const ids = rows.map((r) => r.id);
  const [claim] = await tx
    .update(staleNotices)
    .set({ sentAt: sql`UTC_TIMESTAMP(3)`, detail: sql`JSON_SET(${staleNotices.detail}, '$.outcome', ${outcome})` })
    .where(and(eq(staleNotices.labId, labId), inArray(staleNotices.id, ids), isNull(staleNotices.sentAt)));
  // Someone else claimed part of them between our read and our write: leave the digest to them.
  if (claim.affectedRows !== ids.length) throw new Error("stale notices claimed twice");
  return { ids, notices: rows.map((r) => r.detail as StaleNotice), outcome, items };
}

/** Gives claimed notices back after a failed send, for the next tick (or write) to retry. */
export async function releaseNotices({ ids }: { ids: number[] }): Promise<void> {
  if (!ids.length) return;
  await db.update(staleNotices).set({ sentAt: null }).where(inArray(staleNotices.id, ids));
}

/** Who hears about a lab's printed copies: its managers and the educators who opted in. */
export async function staleRecipients({ labId }: { labId: number }): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.labId, labId),
        or(eq(memberships.role, "manager"), and(eq(memberships.role, "educator"), eq(memberships.notifyStale, true))),
      ),
    );
  return rows.map((r) => r.email);
}

/** The copies on the wall that are stale, by room: what a digest names. */
function staleItems(copies: Awaited<ReturnType<typeof readPostings>>): StaleItem[] {
  return copies
    .filter((c) => STALE.includes(c.status))
    .map((copy) => ({
      room: copy.room,
      chartId: copy.chart.id,
      chartTitle: copy.chart.title,
      editionNumber: copy.edition.number,
      status: copy.status as StaleItem["status"],
      changes: copy.changes,
      current: copy.current ? { editionId: copy.current.id, number: copy.current.number } : null,
    }));
}

/** One edition's facts for the sign-off e-mails, with its author's address. */
export async function signoffFacts({ labId, editionId }: { labId: number; editionId: number }) {
  const [row] = await db
    .select({
      labName: labs.name,
      labSlug: labs.slug,
      timeZone: labs.timeZone,
      chartId: charts.id,
      chartTitle: charts.title,
      editionId: editions.id,
      editionNumber: editions.number,
      authorId: editions.createdBy,
      authorName: users.name,
      authorEmail: users.email,
    })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .innerJoin(labs, eq(labs.id, editions.labId))
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  return row ?? null;
}

/** Who may approve in the lab today: its medical leads, and its managers where the rules grant it. */
export async function approverEmails({
  labId,
  managersMayApprove,
}: {
  labId: number;
  managersMayApprove: boolean;
}): Promise<{ userId: number; email: string }[]> {
  const roles = managersMayApprove ? (["lead", "manager"] as const) : (["lead"] as const);
  return db
    .select({ userId: users.id, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.labId, labId), inArray(memberships.role, [...roles])));
}
