import "server-only";
import { and, eq, isNull, or } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, STALE, type CheckStatus } from "@/lib/editions/check";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { staleNoticeMail, type StaleItem, type StaleNotice } from "@/lib/mail/templates/stale-notice";
import { db } from "../index";
import { charts, editions, labs, memberships, postings, staleNotices, users } from "../schema";
import type { Tx } from "./audit";
import { readHangingCopies } from "./hanging-copies";
import { log } from "@/lib/log";

/**
 * Inside the transaction of a change, after the lab's live snapshots were refreshed: works out
 * every hanging copy's status, stores it, and when copies newly went stale records ONE notice
 * for this change (its key is unique per lab, so a change never mails twice).
 */
export async function reconcilePostings(
  tx: Tx,
  { labId, changeKey, cause }: { labId: number; changeKey: string; cause: string },
) {
  const newlyStale: StaleItem[] = [];
  for (const copy of await readHangingCopies(tx, labId)) {
    if (copy.status === copy.lastStatus) continue;
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
  if (newlyStale.length) {
    const [lab] = await tx.select({ name: labs.name, slug: labs.slug }).from(labs).where(eq(labs.id, labId));
    const detail: StaleNotice = { labName: lab!.name, labSlug: lab!.slug, cause, items: newlyStale };
    await tx.insert(staleNotices).values({ labId, changeKey, detail }).onDuplicateKeyUpdate({ set: { changeKey } });
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

/**
 * After commit: sends each stored notice that has not gone out. A notice is claimed with a
 * conditional update first, so two app instances never send the same one; a failed send is
 * released for the next change (or the next call) to retry.
 */
export async function deliverPendingNotices({ labId }: { labId: number }): Promise<number> {
  const pending = await db
    .select()
    .from(staleNotices)
    .where(and(eq(staleNotices.labId, labId), isNull(staleNotices.sentAt)));
  if (pending.length === 0) return 0;
  const recipients = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.labId, labId),
        or(eq(memberships.role, "manager"), and(eq(memberships.role, "educator"), eq(memberships.notifyStale, true))),
      ),
    );
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
      log.warn({ err, labId, operation: "stale-notice.mail" }, "stale notice not sent; will retry");
      await db.update(staleNotices).set({ sentAt: null }).where(eq(staleNotices.id, notice.id));
    }
  }
  return sent;
}
