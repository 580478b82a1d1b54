import { describe, expect, it } from "vitest";
import { invitationMail } from "@/lib/mail/templates";
import { approvedMail } from "@/lib/mail/templates/signoff";
import { staleDigestMail } from "@/lib/mail/templates/stale-notice";
import { createLabSchema, labNameLinkProblem } from "@/lib/validation/lab";
import { labSettingsPatch } from "@/lib/validation/lab-settings";

const nameIssues = (name: unknown) => {
  const r = createLabSchema.safeParse({ name, slug: "north-cath-lab" });
  return r.success ? [] : r.error.issues.filter((i) => i.path[0] === "name").map((i) => i.message);
};

describe("lab names", () => {
  it("refuse web addresses, e-mail addresses and control characters, naming the field", () => {
    const refused = [
      "URGENT: your hospital account is locked - visit http://evil.example/unlock",
      "Visit evil.example/unlock",
      "Cath lab evil.example",
      "See www.example",
      "HTTPS://EXAMPLE",
      "ftp://x",
      "Write to help@evil.example",
      "a@b",
      "mailto:someone",
      "evil\u3002example", // an ideographic full stop reads as "." in mail programs
      "evil\uFF0Eexample", // fullwidth full stop
      "Lab\u0007bell",
      "Lab\nnext line",
      "Lab\u202Eedoc",
    ];
    for (const name of refused) expect(nameIssues(name), name).not.toEqual([]);
    expect(nameIssues("Visit http://evil.example")[0]).toMatch(/web address/);
    expect(nameIssues("help@evil.example")[0]).toMatch(/e-mail address/);
  });

  it("accept ordinary names, abbreviations with a space included", () => {
    for (const name of [
      "North Cath Lab (illustrative)",
      "St. Anne Cath Lab",
      "Lab 2.0",
      "Hôpital Nord — Salle 2",
      "Cath Lab No.2",
      "U.S. Heart Lab",
      "Lab @ North",
    ])
      expect(labNameLinkProblem(name), name).toBeNull();
    expect(nameIssues("St. Anne Cath Lab")).toEqual([]);
  });

  it("apply when renaming in settings too", () => {
    const r = labSettingsPatch.safeParse({ name: "Unlock at evil.example" });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["name"]);
    expect(labSettingsPatch.safeParse({ name: "St. Anne Cath Lab" }).success).toBe(true);
  });
});

describe("mail quotes the lab name as plain text", () => {
  const labName = 'North <b>"Lab"</b> & co';
  it("invitation: subject and text in quotes; HTML escaped and outside the one link", () => {
    const link = "http://localhost:3000/invite/abc";
    const mail = invitationMail({ labName, role: "educator", inviterName: "M", link, expiresAt: new Date(0) });
    expect(mail.subject).toBe(`Invitation to join the lab "${labName}" on Forkwall`);
    expect(mail.text).toContain(`join the lab "${labName}" on Forkwall`);
    expect(mail.html).toContain("&quot;North &lt;b&gt;&quot;Lab&quot;&lt;/b&gt; &amp; co&quot;");
    expect(mail.html).not.toContain("<b>");
    const anchors = [...mail.html.matchAll(/<a [^>]*>(.*?)<\/a>/g)].map((m) => m[1]);
    expect(anchors).toEqual([link]);
  });

  it("a name that happens to hold the link's text is still not linked", () => {
    const link = "http://x/invite/a";
    const mail = invitationMail({ labName: link, role: "operator", inviterName: "M", link, expiresAt: new Date(0) });
    expect(mail.html.match(/<a /g)).toHaveLength(1);
    expect(mail.html).toContain(`the lab &quot;${link}&quot; on Forkwall`);
  });

  it("sign-off and wall digests quote it too", () => {
    const facts = {
      labName,
      labSlug: "x",
      timeZone: "UTC",
      chartId: 1,
      editionId: 1,
      chartTitle: "T",
      editionNumber: 1,
    };
    const approved = approvedMail({ ...facts, authorName: null, approverName: "A", reviewBy: new Date(0) }, "http://x");
    expect(approved.text).toContain(`in "${labName}".`);
    const digest = staleDigestMail({ labName, labSlug: "x", causes: [], items: [] }, "http://x");
    expect(digest.subject).toContain(`in "${labName}"`);
  });
});
