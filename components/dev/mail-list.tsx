import type { FakeMessage } from "@/lib/mail/fake-server";

const when = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  hour: "2-digit",
  minute: "2-digit",
  second: "2-digit",
  timeZone: "UTC",
  timeZoneName: "short",
});

function Linked({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <>
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="break-all text-brand-700 underline">
            {p}
          </a>
        ) : (
          <span key={i}>{p}</span>
        ),
      )}
    </>
  );
}

export function MailList({ messages }: { messages: FakeMessage[] }) {
  return (
    <ol className="space-y-4">
      {messages.map((m) => (
        <li key={m.id} className="rounded-card border border-line bg-paper-raised p-4">
          <article aria-labelledby={`mail-${m.id}`}>
            <h2 id={`mail-${m.id}`} className="font-semibold">
              {m.subject || "(no subject)"}
            </h2>
            <p className="mt-1 text-xs text-ink-faint">
              To {m.envelopeTo.join(", ")} · from {m.from} · {when.format(new Date(m.receivedAt))}
            </p>
            <pre className="mt-3 whitespace-pre-wrap font-sans text-sm">
              <Linked text={m.text} />
            </pre>
          </article>
        </li>
      ))}
    </ol>
  );
}
