// A local stand-in for a real mail relay: speaks SMTP, keeps what it receives in memory, and
// lists it over a small HTTP interface of its own (GET/DELETE /messages) for people and tests.
// That interface holds password-reset and invitation links, so every call must carry the local
// secret (Authorization: Bearer MAIL_FAKE_SECRET), even from this machine.
import { createHash, timingSafeEqual } from "node:crypto";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

export type FakeMessage = {
  id: number;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
};

export type FakeMailServer = { smtpPort: number; httpPort: number; messages: FakeMessage[]; close(): Promise<void> };

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? "").filter(Boolean));

const MAX_KEPT = 500;

export async function startFakeMail(opts: {
  smtpPort: number;
  httpPort: number;
  host?: string;
  secret: string;
}): Promise<FakeMailServer> {
  if (opts.secret.length < 16) throw new Error("the mail fake needs a secret of at least 16 characters");
  const digest = (s: string) => createHash("sha256").update(s).digest();
  const want = digest(`Bearer ${opts.secret}`);
  const host = opts.host ?? "127.0.0.1";
  const messages: FakeMessage[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            from: addresses(mail.from)[0] ?? "",
            to: addresses(mail.to),
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : null,
          });
          if (messages.length > MAX_KEPT) messages.splice(0, messages.length - MAX_KEPT);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const http: Server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", `http://${host}`);
    if (!timingSafeEqual(digest(req.headers.authorization ?? ""), want)) {
      res.writeHead(401, { "content-type": "application/json" }).end('{"error":"the mail fake wants its secret"}');
      return;
    }
    if (url.pathname !== "/messages") {
      res.writeHead(404, { "content-type": "application/json" }).end('{"error":"not found"}');
      return;
    }
    if (req.method === "DELETE") {
      messages.length = 0;
      res.writeHead(204).end();
      return;
    }
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? messages.filter((m) => m.envelopeTo.some((a) => a.toLowerCase() === to)) : messages;
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list));
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(opts.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    http.once("error", reject);
    http.listen(opts.httpPort, host, () => resolve());
  });

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (http.address() as AddressInfo).port,
    messages,
    close: () =>
      Promise.all([
        new Promise<void>((r) => smtp.close(() => r())),
        new Promise<void>((r) => http.close(() => r())),
      ]).then(() => undefined),
  };
}

export function fakeMailPorts(
  smtpUrl: string,
  fakeUrl: string,
  secret: string,
): { smtpPort: number; httpPort: number; secret: string } {
  return { smtpPort: Number(new URL(smtpUrl).port || 25), httpPort: Number(new URL(fakeUrl).port || 80), secret };
}

/** Headers for a call to the fake's HTTP interface. */
export const fakeMailAuth = (secret: string | undefined) => ({ authorization: `Bearer ${secret ?? ""}` });
