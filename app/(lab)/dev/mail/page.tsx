import { notFound } from "next/navigation";
import { MailList } from "@/components/dev/mail-list";
import { EmptyState } from "@/components/ui/empty-state";
import { FormStatus } from "@/components/ui/form-status";
import { requestFromLoopback } from "@/lib/auth/request-address";
import { listMyLabs } from "@/lib/ops/accounts";
import { currentUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import type { FakeMessage } from "@/lib/mail/fake-server";

export const metadata = { title: "Local mail" };
export const dynamic = "force-dynamic";

// Development aid: what the local mail fake has received. Only managers see it, only while a
// fake is configured (lib/env.ts refuses one unless APP_URL is loopback) and only when the
// request comes from this machine's own socket; to everyone else the page does not exist.
export default async function DevMailPage({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  const fake = env.MAIL_FAKE_URL;
  if (!fake || !env.MAIL_FAKE_SECRET) notFound();
  if (!(await requestFromLoopback())) notFound();
  const user = await currentUser().catch(() => null);
  if (!user) notFound();
  const labs = await listMyLabs({ kind: "user", user });
  if (!labs.some((l) => l.role === "manager")) notFound();

  const { to } = await searchParams;
  const filter = typeof to === "string" && to.trim() ? to.trim().slice(0, 254) : undefined;
  let messages: FakeMessage[] | null = null;
  try {
    const res = await fetch(`${fake}/messages${filter ? `?to=${encodeURIComponent(filter)}` : ""}`, {
      cache: "no-store",
      headers: { authorization: `Bearer ${env.MAIL_FAKE_SECRET}` },
      signal: AbortSignal.timeout(3000),
    });
    if (res.ok) messages = ((await res.json()) as FakeMessage[]).slice().reverse();
  } catch {
    messages = null;
  }

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Local mail</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Messages received by the local mail fake at <code>{fake}</code>, newest first. Nothing here left this machine.
        </p>
      </div>
      <form method="get" className="flex flex-wrap items-end gap-2" role="search">
        <div>
          <label htmlFor="to" className="block text-sm font-medium">
            Recipient
          </label>
          <input
            id="to"
            name="to"
            type="email"
            defaultValue={filter}
            className="mt-1 w-72 rounded-md border border-line-strong bg-white px-3 py-2"
            placeholder="any"
          />
        </div>
        <button
          type="submit"
          className="rounded-md border border-line-strong bg-white px-4 py-2 text-sm font-semibold hover:bg-paper-sunk"
        >
          Filter
        </button>
      </form>
      {messages === null ? (
        <FormStatus message={`The mail fake at ${fake} is not answering. It runs with npm start and npm test.`} />
      ) : messages.length === 0 ? (
        <EmptyState title="No messages">
          {filter
            ? `Nothing was sent to ${filter}.`
            : "Invitations and password resets sent by Forkwall will appear here."}
        </EmptyState>
      ) : (
        <MailList messages={messages} />
      )}
    </div>
  );
}
