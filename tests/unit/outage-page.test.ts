import { describe, expect, it } from "vitest";
import { outageHtml } from "@/lib/outage-page";

describe("the 503 page proxy.ts answers while the database is down", () => {
  it("the check page says the printout cannot be verified and must be treated as unverified", () => {
    const html = outageHtml("check");
    expect(html).toContain("<h1>This printout cannot be verified right now</h1>");
    expect(html).toMatch(/Treat the printout as unverified/);
    expect(html).toContain('<p class="badge">Unverified</p>');
  });

  it("other pages say Forkwall cannot reach its database, and point to the calculator", () => {
    const html = outageHtml("page");
    expect(html).toContain("<h1>Forkwall cannot reach its database right now</h1>");
    expect(html).toContain('href="/calculator"');
  });

  it("is a whole, unindexed document that loads nothing from elsewhere", () => {
    for (const kind of ["page", "check"] as const) {
      const html = outageHtml(kind);
      expect(html.startsWith("<!doctype html>")).toBe(true);
      expect(html).toContain('<meta name="robots" content="noindex">');
      expect(html).not.toMatch(/(src|href)="https?:/);
      expect(html).not.toMatch(/<script/);
    }
  });
});
