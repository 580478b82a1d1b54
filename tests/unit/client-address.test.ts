import { describe, expect, it } from "vitest";
import { parseEnv } from "@/lib/env";
import { clientAddress, PEER_HEADER, socketAddress } from "@/lib/http/client-address";
import { isLoopback, isLoopbackUrl } from "@/lib/net/loopback";

const h = (o: Record<string, string>) => new Headers(o);

describe("client address (finding 3: the client must not choose it)", () => {
  it("is the socket's address, whatever X-Forwarded-For and X-Real-IP say, when no proxy is trusted", () => {
    const spoofed = h({
      [PEER_HEADER]: "192.0.2.10",
      "x-forwarded-for": "198.51.100.1, 203.0.113.7",
      "x-real-ip": "1.2.3.4",
    });
    expect(clientAddress(spoofed, 0)).toBe("192.0.2.10");
    // Changing the header changes nothing: the per-address throttle cannot be bypassed or aimed.
    expect(clientAddress(h({ [PEER_HEADER]: "192.0.2.10", "x-forwarded-for": "10.9.9.9" }), 0)).toBe("192.0.2.10");
    expect(clientAddress(h({ [PEER_HEADER]: "::ffff:127.0.0.1" }), 0)).toBe("127.0.0.1");
  });

  it("without the socket header (not served by server.mjs) is unknown, never a header's word", () => {
    expect(clientAddress(h({ "x-forwarded-for": "203.0.113.7" }), 0)).toBe("unknown");
    expect(clientAddress(h({ "x-forwarded-for": "203.0.113.7" }), 1)).toBe("unknown");
    expect(socketAddress(h({}))).toBeNull();
  });

  it("believes exactly TRUST_PROXY hops of X-Forwarded-For, counted from the socket", () => {
    const viaTwo = h({ [PEER_HEADER]: "10.0.0.2", "x-forwarded-for": "6.6.6.6, 203.0.113.7, 10.0.0.1" });
    expect(clientAddress(viaTwo, 1)).toBe("10.0.0.1");
    expect(clientAddress(viaTwo, 2)).toBe("203.0.113.7");
    // A client-sent entry to the left of what the trusted proxies appended is not believed.
    expect(clientAddress(viaTwo, 2)).not.toBe("6.6.6.6");
    // More hops trusted than the chain has: the left-most entry.
    expect(clientAddress(h({ [PEER_HEADER]: "10.0.0.2" }), 3)).toBe("10.0.0.2");
  });

  it("knows loopback addresses and URLs", () => {
    for (const ip of ["127.0.0.1", "127.1.2.3", "::1", "::ffff:127.0.0.1"]) expect(isLoopback(ip)).toBe(true);
    for (const ip of ["10.0.0.1", "192.0.2.1", "::2", "", null, "127.0.0.1.evil"]) expect(isLoopback(ip)).toBe(false);
    for (const u of ["http://localhost:3000", "http://127.0.0.1:3000", "http://[::1]:3000", "http://app.localhost"])
      expect(isLoopbackUrl(u)).toBe(true);
    for (const u of ["https://forkwall.example", "http://10.0.0.5:3000", "http://localhost.evil.example", "nonsense"])
      expect(isLoopbackUrl(u)).toBe(false);
  });
});

describe("environment (finding 1: the mail fake only on a loopback APP_URL)", () => {
  const base = { MAIL_FAKE_URL: "http://127.0.0.1:2580", MAIL_FAKE_SECRET: "0123456789abcdef0123" };
  const issues = (e: Record<string, string>) =>
    (parseEnv(e).error?.issues ?? []).map((i) => `${i.path.join(".")}: ${i.message}`);

  it("refuses to start with the fake configured and a public APP_URL", () => {
    expect(issues({ ...base, APP_URL: "https://forkwall.example" })).toEqual([
      expect.stringMatching(/^MAIL_FAKE_URL: the local mail fake is for a loopback APP_URL only/),
    ]);
    expect(issues({ ...base, APP_URL: "http://10.1.2.3:3000" })).toHaveLength(1);
  });

  it("accepts the fake on localhost, a public APP_URL without the fake, and refuses a fake without its secret", () => {
    expect(issues({ ...base, APP_URL: "http://localhost:3000" })).toEqual([]);
    expect(issues({ APP_URL: "https://forkwall.example", TRUST_PROXY: "1" })).toEqual([]);
    expect(issues({ MAIL_FAKE_URL: base.MAIL_FAKE_URL })).toEqual([
      expect.stringMatching(/^MAIL_FAKE_SECRET: required/),
    ]);
    expect(issues({ ...base, MAIL_FAKE_URL: "http://mail.example:2580" })).toEqual([
      expect.stringMatching(/loopback address/),
    ]);
    expect(parseEnv({}).data?.TRUST_PROXY).toBe(0);
    expect(issues({ TRUST_PROXY: "-1" })).toHaveLength(1);
  });
});
