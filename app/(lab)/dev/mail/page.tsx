import { notFound } from "next/navigation";
import { MailList } from "@/components/dev/mail-list";
import { EmptyState } from "@/components/ui/empty-state";
import { FormStatus } from "@/components/ui/form-status";
import { requestFromLoopback } from "@/lib/auth/request-address";
import { env } from "@/lib/env";
import { isAppError } from "@/lib/errors";
import { sessionCaller } from "@/lib/ops/caller";
import { readOwnMail } from "@/lib/ops/dev-mail";

export const metadata = { title: "Local mail" };
export const dynamic = "force-dynamic";

// Development aid, only while a mail fake is configured (lib/env.ts refuses one unless APP_URL is
// loopback) and only from this machine's own socket; it shows the signed-in person's own mail.
export default async function DevMailPage() {
  if (!env.MAIL_FAKE_URL || !env.MAIL_FAKE_SECRET) notFound();
  if (!(await requestFromLoopback())) notFound();
  // Nobody signed in, or an address not yet confirmed (so not yet the person's own): no page.
  const mail = await readOwnMail(await sessionCaller()).catch((e: unknown) =>
    isAppError(e) && (e.code === "forbidden" || e.code === "unauthenticated") ? null : Promise.reject(e),
  );
  if (!mail) notFound();
  const { address, messages } = mail;

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Local mail</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Messages the local mail fake received for your address, <strong>{address}</strong>, newest first. Nothing here
          left this machine, and nobody else&apos;s mail is shown.
        </p>
      </div>
      {messages === null ? (
        <FormStatus message="The local mail fake is not answering. It runs with npm start and npm test." />
      ) : messages.length === 0 ? (
        <EmptyState title="No messages">Nothing was sent to {address}.</EmptyState>
      ) : (
        <MailList messages={messages} />
      )}
    </div>
  );
}
