import { afterAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { requestPasswordReset } from "@/lib/ops/accounts";
import { readOwnMail } from "@/lib/ops/dev-mail";
import { inviteMember } from "@/lib/ops/members";
import { addMember, createLab, createUser, sessionUser, unique } from "./support/fixtures";
import { mailTo } from "../support/mail";
import { as } from "../support/roles";

afterAll(() => pool.end());

const asUser = async (id: number) => as(await sessionUser(id));

describe("the local mail page shows a person only their own mail", () => {
  it("two labs' managers: neither reads the other's reset or the other lab's invitations", async () => {
    const [labA, labB] = [await createLab("mail-a"), await createLab("mail-b")];
    const [a, b] = [await createUser("mail-mgr-a"), await createUser("mail-mgr-b")];
    await addMember(labA.id, a.id, "manager");
    await addMember(labB.id, b.id, "manager");
    const invitee = `${unique("invitee")}@example.test`;

    expect(await requestPasswordReset({ email: b.email })).toBe("sent");
    await inviteMember(await asUser(b.id), { lab: labB.slug }, { email: invitee, role: "operator" });
    expect((await mailTo(b.email)).length).toBe(1);
    expect((await mailTo(invitee)).length).toBe(1);

    const seenByA = await readOwnMail(await asUser(a.id));
    expect(seenByA.address).toBe(a.email);
    expect(seenByA.messages).toEqual([]);

    const seenByB = await readOwnMail(await asUser(b.id));
    expect(seenByB.messages?.map((m) => m.envelopeTo)).toEqual([[b.email]]);
    expect(seenByB.messages?.[0]?.text).toMatch(/\/reset-password\//);
    expect(JSON.stringify(seenByB.messages)).not.toContain(invitee);
  });

  it("an account that has not confirmed its address sees nothing", async () => {
    const u = await createUser("mail-unconfirmed");
    await pool.query("UPDATE users SET email_verified_at = NULL WHERE id = ?", [u.id]);
    await expect(readOwnMail(await asUser(u.id))).rejects.toMatchObject({ code: "forbidden" });
  });

  it("nobody signed in reads anything", async () => {
    await expect(readOwnMail({ kind: "anonymous" })).rejects.toMatchObject({ code: "unauthenticated" });
  });
});
