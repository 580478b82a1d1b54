import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fakeMailAuth, startFakeMail, type FakeMailServer } from "@/lib/mail/fake-server";

// Finding 14: the fake's HTTP interface holds reset and invitation links; without the local
// secret it answers nothing, even to a caller on this machine.
describe("mail fake HTTP interface", () => {
  const secret = "a-local-secret-of-some-length";
  let fake: FakeMailServer;
  let base: string;
  beforeAll(async () => {
    fake = await startFakeMail({ smtpPort: 0, httpPort: 0, secret });
    base = `http://127.0.0.1:${fake.httpPort}`;
    await nodemailer
      .createTransport({ host: "127.0.0.1", port: fake.smtpPort, secure: false, ignoreTLS: true })
      .sendMail({ from: "a@forkwall.test", to: "b@forkwall.test", subject: "reset", text: "link" });
  });
  afterAll(() => fake.close());

  it("refuses callers without the secret or with a wrong one (401), for reads and deletes", async () => {
    for (const headers of [{}, fakeMailAuth("wrong-secret-wrong-secret"), { authorization: secret }]) {
      expect((await fetch(`${base}/messages`, { headers })).status).toBe(401);
      expect((await fetch(`${base}/messages`, { method: "DELETE", headers })).status).toBe(401);
    }
    expect(fake.messages).toHaveLength(1);
  });

  it("answers with the secret", async () => {
    const res = await fetch(`${base}/messages?to=b@forkwall.test`, { headers: fakeMailAuth(secret) });
    expect(res.status).toBe(200);
    expect(((await res.json()) as { subject: string }[]).map((m) => m.subject)).toEqual(["reset"]);
  });

  it("will not start without a secret", async () => {
    await expect(startFakeMail({ smtpPort: 0, httpPort: 0, secret: "" })).rejects.toThrow(/secret/);
  });
});
