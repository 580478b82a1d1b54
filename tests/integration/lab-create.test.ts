// Creating labs (the web's operation and the operator's command), leaving labs and the account
// page's operations, on the real MariaDB and the local mail fake.
import { and, count, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, invitations, labs, memberships, users } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/password";
import { changeName, changePassword, leaveLab, requestEmailChange } from "@/lib/ops/account-settings";
import { createLab, createLabByOperator } from "@/lib/ops/lab-create";
import { verifyEmail } from "@/lib/ops/sign-up";
import { RESERVED_SLUGS, suggestSlug } from "@/lib/validation/lab";
import { addMember, createUser, FIXTURE_PASSWORD, unique } from "./support/fixtures";
import { linkIn, mailTo } from "../support/mail";
import { as } from "../support/roles";
import { refusal } from "../support/refusal";

afterAll(() => pool.end());

const labCount = async () => Number((await db.select({ n: count() }).from(labs))[0]!.n);
const labBySlug = async (slug: string) => (await db.select().from(labs).where(eq(labs.slug, slug)))[0];

describe("creating a lab", () => {
  it("201-shaped answer; the creator becomes its only member, as manager; audited", async () => {
    const me = await createUser("creator");
    const slug = unique("north");
    const res = await createLab(as(me), { name: "  North Cath Lab (illustrative) ", slug });
    expect(res).toEqual({ lab: { slug, name: "North Cath Lab (illustrative)" }, role: "manager" });
    const lab = (await labBySlug(slug))!;
    expect(lab.isDemo).toBe(false);
    expect(
      await db
        .select({ userId: memberships.userId, role: memberships.role })
        .from(memberships)
        .where(eq(memberships.labId, lab.id)),
    ).toEqual([{ userId: me.id, role: "manager" }]);
    const [audit] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, lab.id), eq(auditEvents.action, "lab.created")));
    expect(audit?.actorUserId).toBe(me.id);
    expect(audit?.detail).toEqual({ name: "North Cath Lab (illustrative)", slug, via: "web" });
  });

  it("refuses slugs outside the rules with 400 naming slug, and creates nothing", async () => {
    const me = await createUser("slugs");
    const before = await labCount();
    const bad = [
      "ab",
      "a".repeat(49),
      "North-Lab",
      "north_lab",
      "north lab",
      "-north",
      "north-",
      "north--lab",
      "new",
      "api",
      "admin",
      "settings",
      "",
      "lab/../x",
    ];
    for (const slug of bad) {
      const err = await refusal(createLab(as(me), { name: "Any name", slug }));
      expect(err.status, slug).toBe(400);
      expect(err.issues?.map((i) => i.path.join("."))).toContain("slug");
    }
    const both = await refusal(createLab(as(me), { name: "", slug: "x" }));
    expect(both.issues?.map((i) => i.path[0]).sort()).toEqual(["name", "slug"]);
    expect((await refusal(createLab(as(me), { name: "Lab", slug: unique("ok"), extra: 1 }))).status).toBe(400);
    expect(await labCount()).toBe(before);
    // Edges of the length rule are allowed.
    const three = `z${unique("").slice(-2)}`.slice(0, 3);
    expect((await createLab(as(me), { name: "Shortest", slug: three })).lab.slug).toBe(three);
    const long = `${unique("l")}${"x".repeat(48)}`.slice(0, 48);
    expect((await createLab(as(me), { name: "Longest", slug: long })).lab.slug).toBe(long);
  });

  it("answers 409 naming slug for a taken slug, and leaves the existing lab alone", async () => {
    const me = await createUser("taken");
    const other = await createUser("other");
    const slug = unique("taken");
    await createLab(as(me), { name: "First (illustrative)", slug });
    const before = await labCount();
    const err = await refusal(createLab(as(other), { name: "Second (illustrative)", slug }));
    expect(err.status).toBe(409);
    expect(err.issues).toEqual([{ path: ["slug"], message: "Already taken: choose another." }]);
    expect(await labCount()).toBe(before);
    const lab = (await labBySlug(slug))!;
    expect(lab.name).toBe("First (illustrative)");
    const members = await db.select().from(memberships).where(eq(memberships.labId, lab.id));
    expect(members.map((m) => m.userId)).toEqual([me.id]);
  });

  it("anonymous callers get 401", async () => {
    expect((await refusal(createLab({ kind: "anonymous" }, { name: "Nobody", slug: unique("anon") }))).status).toBe(
      401,
    );
  });

  it("suggests slugs that pass the rules", () => {
    expect(suggestSlug("Hôpital Nord — Salle 2")).toBe("hopital-nord-salle-2");
    expect(suggestSlug("New")).toBe("new-lab");
    expect(suggestSlug("  ")).toBe("");
    expect(RESERVED_SLUGS.has("settings")).toBe(true);
  });
});

describe("npm run lab:create (createLabByOperator)", () => {
  it("creates an empty lab and invites the manager by e-mail; the invitation is the existing kind", async () => {
    const slug = unique("cli");
    const manager = `${unique("cli-manager")}@example.test`;
    const res = await createLabByOperator({
      name: "Operator Lab (illustrative)",
      slug,
      manager: manager.toUpperCase(),
    });
    expect(res).toMatchObject({ lab: { slug }, invitation: { email: manager }, emailSent: true });
    const lab = (await labBySlug(slug))!;
    expect(await db.select().from(memberships).where(eq(memberships.labId, lab.id))).toEqual([]);
    const [inv] = await db.select().from(invitations).where(eq(invitations.labId, lab.id));
    expect(inv).toMatchObject({ email: manager, role: "manager", invitedBy: null });
    const [mail] = await mailTo(manager);
    expect(mail?.subject).toBe('Invitation to join the lab "Operator Lab (illustrative)" on Forkwall');
    expect(linkIn(mail!.text, "invite").url).toContain("/invite/");
  });

  it("refuses a bad e-mail (400) or a taken slug (409) and creates nothing", async () => {
    const before = await labCount();
    const bad = await refusal(createLabByOperator({ name: "X Lab", slug: unique("cli-bad"), manager: "nobody" }));
    expect(bad.status).toBe(400);
    expect(bad.issues?.[0]?.path).toEqual(["manager"]);
    const slug = unique("cli-taken");
    await createLabByOperator({ name: "Taken Lab", slug, manager: `${unique("m")}@example.test` });
    const again = `${unique("m2")}@example.test`;
    expect((await refusal(createLabByOperator({ name: "Again", slug, manager: again }))).status).toBe(409);
    expect(await labCount()).toBe(before + 1);
    expect(await db.select().from(invitations).where(eq(invitations.email, again))).toEqual([]);
    expect(await mailTo(again)).toEqual([]);
  });
});

describe("the account page's operations", () => {
  it("leaving: refused for the last manager with a clear message; others leave", async () => {
    const manager = await createUser("leaver-m");
    const educator = await createUser("leaver-e");
    const slug = unique("leave");
    await createLab(as(manager), { name: "Leave Lab (illustrative)", slug });
    const lab = (await labBySlug(slug))!;
    await addMember(lab.id, educator.id, "educator");
    const err = await refusal(leaveLab(as(manager), { lab: slug }));
    expect(err.status).toBe(409);
    expect(err.message).toMatch(/only manager of Leave Lab \(illustrative\).*Make another member a manager/);
    expect(await db.select().from(memberships).where(eq(memberships.labId, lab.id))).toHaveLength(2);
    await leaveLab(as(educator), { lab: slug });
    const left = await db.select({ userId: memberships.userId }).from(memberships).where(eq(memberships.labId, lab.id));
    expect(left).toEqual([{ userId: manager.id }]);
    // Not a member any more: the lab is "not found" for them.
    expect((await refusal(leaveLab(as(educator), { lab: slug }))).status).toBe(404);
  });

  it("name: 400 naming the field, else saved", async () => {
    const me = await createUser("namer");
    expect((await refusal(changeName(as(me), { name: "" }))).issues?.[0]?.path).toEqual(["name"]);
    expect(await changeName(as(me), { name: "Dr New Name" })).toEqual({ changed: true });
    expect((await db.select().from(users).where(eq(users.id, me.id)))[0]!.name).toBe("Dr New Name");
  });

  it("password: needs the current one (400 naming currentPassword, nothing changed); a change ends sessions", async () => {
    const me = await createUser("pw");
    const [before] = await db.select().from(users).where(eq(users.id, me.id));
    const wrong = await refusal(
      changePassword(as(me), {
        currentPassword: "wrong password",
        password: "brand new phrase",
        confirm: "brand new phrase",
      }),
    );
    expect(wrong.status).toBe(400);
    expect(wrong.issues?.[0]?.path).toEqual(["currentPassword"]);
    expect((await db.select().from(users).where(eq(users.id, me.id)))[0]).toEqual(before);
    await changePassword(as(me), {
      currentPassword: FIXTURE_PASSWORD,
      password: "brand new phrase",
      confirm: "brand new phrase",
    });
    const [after] = await db.select().from(users).where(eq(users.id, me.id));
    expect(await verifyPassword("brand new phrase", after!.passwordHash)).toBe(true);
    expect(after!.sessionVersion).toBe(before!.sessionVersion + 1);
  });

  it("e-mail: takes effect only through the link sent to the new address; a taken address changes nothing", async () => {
    const me = await createUser("mover");
    const target = `${unique("moved")}@example.test`;
    await requestEmailChange(as(me), { email: target, currentPassword: FIXTURE_PASSWORD });
    expect((await db.select().from(users).where(eq(users.id, me.id)))[0]!.email).toBe(me.email);
    const [mail] = await mailTo(target);
    const token = mail!.text.match(/verify-email\/([A-Za-z0-9_-]{43})/)![1]!;
    expect(await verifyEmail({ token })).toMatchObject({ email: target, changedFrom: me.email });
    expect((await db.select().from(users).where(eq(users.id, me.id)))[0]!.email).toBe(target);
    expect((await mailTo(me.email)).map((m) => m.subject)).toContain("Your Forkwall e-mail address was changed");

    const other = await createUser("holder");
    await requestEmailChange(as({ ...me, email: target }), { email: other.email, currentPassword: FIXTURE_PASSWORD });
    const notes = await mailTo(other.email);
    expect(notes.map((m) => m.subject)).toEqual(["This address already has a Forkwall account"]);
    expect((await db.select().from(users).where(eq(users.id, me.id)))[0]!.email).toBe(target);
    const wrong = await refusal(
      requestEmailChange(as(me), { email: `${unique("x")}@example.test`, currentPassword: "nope" }),
    );
    expect(wrong.issues?.[0]?.path).toEqual(["currentPassword"]);
  });
});
