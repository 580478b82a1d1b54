import "server-only";
import { and, eq, isNull, or } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, STALE, type CheckStatus } from "@/lib/editions/check";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { staleNoticeMail, type StaleItem, type StaleNotice } from "@/lib/mail/templates/stale-notice";
import { db } from "../index";
import { charts, editions, labs, memberships, postings, rooms, staleNotices, users } from "../schema";
import type { Tx } from "./audit";

/**
 * Inside the transaction of a change, after the lab's live snapshots were refreshed: works out
 * every hanging copy's status, stores it, and when copies newly went stale records ONE notice
 * for this change (its key is unique per lab, so a change never mails twice).
 */
export async function reconcilePostings(tx: Tx, { labId, changeKey, cause }: { labId: number; changeKey: string; cause: string }) {
  const rows = await tx
    .select({
      postingId: postings.id,
      lastStatus: postings.lastStatus,
      room: rooms.name,
      edition: editions,
      chart: { id: charts.id, title: charts.title, liveFingerprint: charts.liveFingerprint, liveSnapshot: charts.liveSnapshot },
    })
    .from(postings)
    .innerJoin(rooms, eq(rooms.id, postings.roomId))
    .innerJoin(editions, eq(editions.id, postings.editionId))
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .where(and(eq(postings.labId, labId), isNull(postings.removedAt)));
  if (rows.length === 0) return [];
  const approved = await tx
    .select({ id: editions.id, chartId: editions.chartId, number: editions.number, approvedAt: editions.approvedAt })
    .from(editions)
    .where(and(eq(editions.labId, labId), eq(editions.status, "approved")));
  const newlyStale: StaleItem[] = [];
  for (const r of rows) {
    const current = approved.find((a) => a.chartId === r.chart.id && a.id !== r.edition.id) ?? null;
    const result = checkEdition({ ...r.edition, snapshot: r.edition.snapshot as Snapshot }, { liveFingerprint: r.chart.liveFingerprint, liveSnapshot: r.chart.liveSnapshot as Snapshot | null }, current);
    if (result.status === r.lastStatus) continue;
    await tx.update(postings).set({ lastStatus: result.status }).where(and(eq(postings.id, r.postingId), eq(postings.labId, labId)));
    if (STALE.includes(result.status) && !STALE.includes(r.lastStatus as CheckStatus)) {
      newlyStale.push({
        room: r.room,
        chartId: r.chart.id,
        chartTitle: r.chart.title,
        editionNumber: r.edition.number,
        status: result.status as StaleItem["status"],
        changes: result.changes.map((c) => c.detail),
        current: current ? { editionId: current.id, number: current.number } : null,
      });
    }
  }
  if (newlyStale.length) {
    const [lab] = await tx.select({ name: labs.name, slug: labs.slug }).from(labs).where(eq(labs.id, labId));
    const detail: StaleNotice = { labName: lab!.name, labSlug: lab!.slug, cause, items: newlyStale };
    await tx.insert(staleNotices).values({ labId, changeKey, detail }).onDuplicateKeyUpdate({ set: { changeKey } });
  }
  return newlyStale;
}

/** Status a new posting starts from, so hanging an already stale copy does not mail anyone. */
export async function initialPostingStatus(tx: Tx, { labId, editionId }: { labId: number; editionId: number }): Promise<CheckStatus> {
  const [r] = await tx
    .select({ edition: editions, chart: { liveFingerprint: charts.liveFingerprint, liveSnapshot: charts.liveSnapshot } })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  if (!r) return "current";
  return checkEdition({ ...r.edition, snapshot: r.edition.snapshot as Snapshot }, { liveFingerprint: r.chart.liveFingerprint, liveSnapshot: r.chart.liveSnapshot as Snapshot | null }, null).status;
}

/**
 * After commit: sends each stored notice that has not gone out. A notice is claimed with a
 * conditional update first, so two app instances never send the same one; a failed send is
 * released for the next change (or the next call) to retry.
 */
export async function deliverPendingNotices({ labId }: { labId: number }): Promise<number> {
  const pending = await db.select().from(staleNotices).where(and(eq(staleNotices.labId, labId), isNull(staleNotices.sentAt)));
  if (pending.length === 0) return 0;
  const recipients = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.labId, labId), or(eq(memberships.role, "manager"), and(eq(memberships.role, "educator"), eq(memberships.notifyStale, true)))));
  let sent = 0;
  for (const notice of pending) {
    const [claim] = await db
      .update(staleNotices)
      .set({ sentAt: new Date() })
      .where(and(eq(staleNotices.id, notice.id), isNull(staleNotices.sentAt)));
    if (claim.affectedRows !== 1 || recipients.length === 0) continue;
    const mail = staleNoticeMail(notice.detail as StaleNotice, env.APP_URL);
    try {
      await sendMail({ to: recipients.map((r) => r.email), ...mail });
      sent++;
    } catch (err) {
      console.error("stale notice not sent; will retry", err);
      await db.update(staleNotices).set({ sentAt: null }).where(eq(staleNotices.id, notice.id));
    }
  }
  return sent;
}
