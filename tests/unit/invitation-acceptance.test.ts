import { describe, expect, it } from "vitest";
import { acceptanceRefusal, type AcceptanceFacts } from "@/lib/auth/invitation-acceptance";

const now = new Date("2026-06-01T12:00:00Z");
const invitation = {
  email: "invited@example.test",
  expiresAt: new Date("2026-06-02T12:00:00Z"),
  acceptedAt: null,
  revokedAt: null,
};
const member = (email: string | null): AcceptanceFacts["joiner"] => ({
  kind: "member",
  account: email === null ? null : { email },
});
const status = (f: AcceptanceFacts) => acceptanceRefusal(f, now)?.status ?? null;

describe("accepting an invitation", () => {
  it("lets the invited address in, as a new account or a signed-in one", () => {
    expect(status({ invitation, joiner: { kind: "new-account", addressTaken: false } })).toBeNull();
    expect(status({ invitation, joiner: member("invited@example.test") })).toBeNull();
  });

  it("refuses another account (403, naming the invited address) and a taken address for a new account (409)", () => {
    const other = acceptanceRefusal({ invitation, joiner: member("someone@example.test") }, now);
    expect(other?.status).toBe(403);
    expect(other?.message).toBe("This invitation is for invited@example.test. Sign in with that address to accept it.");
    expect(status({ invitation, joiner: member(null) })).toBe(403);
    expect(status({ invitation, joiner: { kind: "new-account", addressTaken: true } })).toBe(409);
  });

  it("refuses an unknown link (404) and an expired, used or withdrawn one (409) before looking at who asks", () => {
    expect(status({ invitation: null, joiner: member("invited@example.test") })).toBe(404);
    const joiner = member("someone@example.test");
    expect(status({ invitation: { ...invitation, expiresAt: now }, joiner })).toBe(409);
    expect(status({ invitation: { ...invitation, acceptedAt: now }, joiner })).toBe(409);
    expect(acceptanceRefusal({ invitation: { ...invitation, revokedAt: now }, joiner }, now)?.message).toMatch(
      /withdrawn/,
    );
  });
});
