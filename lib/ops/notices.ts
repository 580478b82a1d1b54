import "server-only";
import { claimDueNotices, listLabsWithPendingNotices, releaseNotices, staleRecipients } from "@/db/queries/notices";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { sendMail } from "@/lib/mail/send";
import { allClearMail, staleDigestMail } from "@/lib/mail/templates/stale-notice";
import { runTransaction } from "./transaction";

export type DigestResult = "digest" | "all-clear" | "quiet" | "no-recipients" | "failed";

/**
 * Mails one lab's stale-copy digest once the lab has been quiet for the quiet period
 * (STALE_MAIL_QUIET_SECONDS): the unsent notices are claimed in one transaction (two app
 * instances, or two Galera nodes, never both send them), then one e-mail names every copy that
 * is stale now, room by room, with what changed; when every copy is current again after a
 * digest it is an all-clear instead. A failed send gives the notices back for the next try.
 * Null when nothing was due.
 */
export async function deliverDigest({
  labId,
  quietSeconds = env.STALE_MAIL_QUIET_SECONDS,
}: {
  labId: number;
  quietSeconds?: number;
}): Promise<DigestResult | null> {
  const claim = await runTransaction((tx) => claimDueNotices(tx, { labId, quietSeconds }));
  if (!claim) return null;
  if (claim.outcome === "quiet") return "quiet";
  const last = claim.notices.at(-1)!;
  const digest = {
    labName: last.labName,
    labSlug: last.labSlug,
    causes: claim.notices.map((n) => n.cause),
    items: claim.items,
  };
  const to = await staleRecipients({ labId });
  if (!to.length) return "no-recipients";
  try {
    const mail = claim.outcome === "digest" ? staleDigestMail(digest, env.APP_URL) : allClearMail(digest, env.APP_URL);
    await sendMail({ to, ...mail });
    return claim.outcome;
  } catch (err) {
    log.warn({ err, labId, notices: claim.ids }, "stale-copy digest not sent; will retry");
    await releaseNotices({ ids: claim.ids });
    return "failed";
  }
}

/** Every lab whose digest is due (the timer's tick); one lab's failure does not stop the others. */
export async function deliverDueDigests(opts: { quietSeconds?: number } = {}): Promise<number> {
  let sent = 0;
  for (const labId of await listLabsWithPendingNotices()) {
    try {
      const outcome = await deliverDigest({ labId, ...opts });
      if (outcome === "digest" || outcome === "all-clear") sent++;
    } catch (err) {
      log.warn({ err, labId }, "stale-copy digest could not be claimed; will retry");
    }
  }
  return sent;
}

/** After a write commits: the lab's digest goes out now if its quiet period has already passed. */
export async function deliverPendingNotices({ labId }: { labId: number }): Promise<void> {
  try {
    await deliverDigest({ labId });
  } catch (err) {
    log.warn({ err, labId }, "stale-copy digest could not be claimed; will retry");
  }
}
