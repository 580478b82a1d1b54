import { describe, expect, it } from "vitest";
import { describeAction, describeDetail } from "@/lib/audit/describe";

describe("audit log wording", () => {
  it("names known actions and keeps unknown ones readable", () => {
    expect(describeAction("member.role_changed")).toBe("Changed a member's role");
    expect(describeAction("stock.balloon_added")).toBe("stock balloon added");
  });

  it("shows role changes as before -> after with role names", () => {
    expect(describeDetail({ member: "a@x.test", before: { role: "educator" }, after: { role: "operator" } })).toEqual([
      { label: "Member", value: "a@x.test" },
      { label: "Role", before: "Educator", after: "Operator" },
    ]);
  });

  it("marks removals and copes with empty or odd detail", () => {
    expect(describeDetail({ before: { role: "lead" }, after: null })).toEqual([
      { label: "Role", before: "Medical lead", after: "removed" },
    ]);
    expect(describeDetail(null)).toEqual([]);
    expect(describeDetail([1, 2])).toEqual([{ label: "Detail", value: "[1,2]" }]);
    expect(describeDetail({ expiresAt: "2026-01-02T03:04:05.000Z", newAccount: true })).toEqual([
      { label: "Link expires", value: "2026-01-02 03:04 UTC" },
      { label: "New account", value: "yes" },
    ]);
  });
});
