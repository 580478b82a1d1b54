import { describe, expect, it } from "vitest";
import { firstRunSteps, type FirstRunStatus } from "@/lib/labs/first-run";

const status = (over: Partial<FirstRunStatus> = {}): FirstRunStatus => ({
  familiesWithStock: 1,
  sizesInStock: 1,
  members: { lead: 0, educator: 0 },
  invited: { lead: 0, educator: 0 },
  charts: 1,
  approvedEditions: 0,
  ...over,
});
const words = (s: FirstRunStatus) => JSON.stringify(firstRunSteps("demo", s));

describe("first-run steps read as sentences", () => {
  it("never writes an article after a count or after No, nor a plural after 1", () => {
    for (const n of [0, 1, 2]) {
      const text = words(status({ sizesInStock: n, familiesWithStock: n, members: { lead: n, educator: n } }));
      expect(text).not.toMatch(/\b(No|\d+) an? /);
      expect(text).not.toMatch(/\b1 (sizes|families|medical leads|educators|charts)\b/);
    }
    expect(words(status())).toContain("No medical lead yet");
    expect(words(status({ members: { lead: 1, educator: 2 } }))).toMatch(/1 medical lead in the lab.*2 educators in/);
    expect(words(status())).toContain("1 balloon size in stock in 1 family");
  });

  it("links each invitation step to the form with its role chosen", () => {
    const [, lead, educator] = firstRunSteps("demo", status());
    expect(lead!.title).toBe("Invite a medical lead");
    expect(lead!.links[0]).toEqual({
      href: "/labs/demo/members?role=lead#invite-heading",
      label: "Invite a medical lead",
    });
    expect(educator!.links[0]!.href).toBe("/labs/demo/members?role=educator#invite-heading");
  });
});
