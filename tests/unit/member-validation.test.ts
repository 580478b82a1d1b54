import { describe, expect, it } from "vitest";
import { invitationMail, passwordResetMail } from "@/lib/mail/templates";
import { acceptNewAccountSchema, resetPasswordSchema } from "@/lib/validation/auth";
import { auditQuerySchema } from "@/lib/validation/audit";
import { idSchema } from "@/lib/validation/id";
import { changeRoleSchema, inviteSchema } from "@/lib/validation/members";

const token = "A".repeat(43);
const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join("."), i.message]));

describe("member and account input", () => {
  it("normalises invited addresses and names the field that is wrong", () => {
    expect(inviteSchema.parse({ email: "  Dr.Who@Example.TEST ", role: "lead" })).toEqual({
      email: "dr.who@example.test",
      role: "lead",
    });
    expect(issues(inviteSchema.safeParse({ email: "nope", role: "chief" }))).toEqual({
      email: "Enter a valid e-mail address, like name@hospital.example.",
      role: "Choose a role: manager, lead, educator, operator.",
    });
    expect(issues(inviteSchema.safeParse({ email: "", role: "lead" })).email).toBe("Enter an e-mail address.");
    expect(changeRoleSchema.safeParse({ role: "operator" }).success).toBe(true);
  });

  it("accepts only positive whole ids and bounded audit pages", () => {
    expect(idSchema.parse("12")).toBe(12);
    for (const bad of ["0", "-1", "1.5", "abc", ""]) expect(idSchema.safeParse(bad).success, bad).toBe(false);
    expect(auditQuerySchema.parse({})).toEqual({ limit: 50 });
    expect(auditQuerySchema.safeParse({ limit: "500" }).success).toBe(false);
  });

  it("asks for a name, a long enough password typed twice, and a well-formed token", () => {
    const ok = { token, name: "Dr A. Rivera", password: "correct horse battery", confirm: "correct horse battery" };
    expect(acceptNewAccountSchema.safeParse(ok).success).toBe(true);
    expect(issues(acceptNewAccountSchema.safeParse({ ...ok, confirm: "other" }))).toEqual({
      confirm: "The two passwords differ.",
    });
    expect(issues(acceptNewAccountSchema.safeParse({ ...ok, password: "short", confirm: "short" })).password).toMatch(
      /at least 10/,
    );
    expect(issues(acceptNewAccountSchema.safeParse({ ...ok, name: " " })).name).toMatch(/Enter your name/);
    expect(
      issues(resetPasswordSchema.safeParse({ token: "x", password: "p".repeat(12), confirm: "p".repeat(12) })).token,
    ).toBe("This link is not valid.");
    // 25 three-byte characters are 75 bytes: more than bcrypt reads.
    const long = "€".repeat(25);
    expect(issues(resetPasswordSchema.safeParse({ token, password: long, confirm: long })).password).toMatch(
      /72 bytes/,
    );
  });
});

describe("e-mails", () => {
  it("carry the link, the lab, the role and the expiry, in text and HTML", () => {
    const mail = invitationMail({
      labName: "Lab <A>",
      role: "educator",
      inviterName: "M",
      link: "http://localhost:3000/invite/abc",
      expiresAt: new Date("2026-05-01T10:00:00Z"),
    });
    expect(mail.subject).toBe('Invitation to join the lab "Lab <A>" on Forkwall');
    expect(mail.text).toContain("http://localhost:3000/invite/abc");
    expect(mail.text).toContain("as educator");
    expect(mail.text).toContain("2026-05-01 10:00 UTC");
    expect(mail.html).toContain('<a href="http://localhost:3000/invite/abc">');
    expect(mail.html).toContain("&quot;Lab &lt;A&gt;&quot;");
    const reset = passwordResetMail({
      link: "http://localhost:3000/reset-password/xyz",
      expiresAt: new Date("2026-05-01T10:00:00Z"),
    });
    expect(reset.text).toContain("http://localhost:3000/reset-password/xyz");
  });
});

describe("invitation e-mail in the lab's time zone", () => {
  it("shows the expiry in the one date format, in the lab's zone, naming the zone", () => {
    const expiresAt = new Date("2026-05-01T22:30:00Z");
    const mail = invitationMail({
      labName: "L",
      role: "operator",
      inviterName: "M",
      link: "http://x/invite/a",
      expiresAt,
      timeZone: "Asia/Kolkata",
    });
    expect(mail.text).toContain("expires at 2026-05-02 04:00 (Asia/Kolkata)");
    expect(mail.text).not.toContain("UTC");
  });
});
