import { mailTo } from "../../support/mail";
import { until } from "../../support/poll";
import { query } from "./db";

/**
 * Waits until no stale-copy notice waits for its digest and every digest already claimed for
 * `address` has reached the fake (a claim commits before its e-mail is sent), so a test counting
 * e-mails starts from, or ends on, a settled mailbox.
 */
export async function settleStaleMail(address: string): Promise<void> {
  const pending = async () =>
    Number((await query<{ n: number }>("SELECT COUNT(*) AS n FROM stale_notices WHERE sent_at IS NULL"))[0]!.n);
  await until("stale-copy digests still waiting", pending, (n) => n === 0);
  // One claim stamps all its notices with the same sent_at: one digest e-mail per (lab, sent_at).
  const [claimed] = await query<{ n: number }>(
    `SELECT COUNT(DISTINCT n.lab_id, n.sent_at) AS n FROM stale_notices n
       JOIN memberships m ON m.lab_id = n.lab_id JOIN users u ON u.id = m.user_id
      WHERE u.email = ? AND (m.role = 'manager' OR (m.role = 'educator' AND m.notify_stale))
        AND JSON_VALUE(n.detail, '$.outcome') IN ('digest', 'all-clear')`,
    [address],
  );
  await until(
    `every claimed stale-copy digest to ${address}`,
    () => mailTo(address),
    (mails) => mails.filter((m) => m.subject.includes("wall printout")).length >= Number(claimed!.n),
  );
}
