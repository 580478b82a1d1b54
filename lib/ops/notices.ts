import "server-only";
import { claimNotice, listPendingNotices, releaseNotice } from "@/db/queries/notices";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { sendMail } from "@/lib/mail/send";
import { staleNoticeMail } from "@/lib/mail/templates/stale-notice";

/**
 * After commit: mails each stored stale-copy notice that has not gone out. Each is claimed first,
 * so two app instances never send the same one; a failed send is released for the next try.
 */
export async function deliverPendingNotices({ labId }: { labId: number }): Promise<number> {
  const { pending, recipients } = await listPendingNotices({ labId });
  let sent = 0;
  for (const notice of pending) {
    if (!(await claimNotice({ id: notice.id })) || recipients.length === 0) continue;
    try {
      await sendMail({ to: recipients.map((r) => r.email), ...staleNoticeMail(notice.detail, env.APP_URL) });
      sent++;
    } catch (err) {
      log.warn({ err, labId, notice: notice.id }, "stale notice not sent; will retry");
      await releaseNotice({ id: notice.id });
    }
  }
  return sent;
}
