import "server-only";
import { getLabRules } from "@/db/queries/lab-rules";
import { approverEmails, signoffFacts } from "@/db/queries/notices";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { sendMail } from "@/lib/mail/send";
import { approvedMail, returnedMail, waitingForSignoffMail } from "@/lib/mail/templates/signoff";

export type SignoffEvent =
  | { kind: "submitted"; labId: number; editionId: number; byUserId: number }
  | { kind: "approved"; labId: number; editionId: number; byName: string; reviewBy: Date }
  | { kind: "returned"; labId: number; editionId: number; byName: string; reason: string };

/**
 * After the change committed: a new draft mails everyone who may approve it (not its author); an
 * approval or a return mails the draft's author. A failed send is logged, never undoes the change.
 */
export async function mailSignoff(event: SignoffEvent): Promise<void> {
  try {
    const facts = await signoffFacts(event);
    if (!facts) return;
    if (event.kind === "submitted") {
      const { managersMayApprove } = await getLabRules({ labId: event.labId });
      const to = (await approverEmails({ labId: event.labId, managersMayApprove }))
        .filter((a) => a.userId !== event.byUserId)
        .map((a) => a.email);
      if (to.length) await sendMail({ to, ...waitingForSignoffMail(facts, env.APP_URL) });
      return;
    }
    if (!facts.authorEmail) return;
    const mail =
      event.kind === "approved"
        ? approvedMail({ ...facts, approverName: event.byName, reviewBy: event.reviewBy }, env.APP_URL)
        : returnedMail({ ...facts, returnerName: event.byName, reason: event.reason }, env.APP_URL);
    await sendMail({ to: facts.authorEmail, ...mail });
  } catch (err) {
    log.warn({ err, ...event }, "sign-off e-mail not sent");
  }
}
