import { describe, expect, it } from "vitest";
import { isBrowserNavigation, signInRedirectFor } from "@/lib/http/sign-in-redirect";

describe("a mailed link opened while signed out", () => {
  it("is a navigation for a clicked link, not for fetches, programs or tokens", () => {
    expect(isBrowserNavigation(new Headers({ "sec-fetch-mode": "navigate" }))).toBe(true);
    expect(isBrowserNavigation(new Headers({ "sec-fetch-mode": "cors", accept: "text/html" }))).toBe(false);
    expect(isBrowserNavigation(new Headers({ accept: "text/html,application/xhtml+xml" }))).toBe(true);
    expect(isBrowserNavigation(new Headers({ accept: "application/json" }))).toBe(false);
    expect(isBrowserNavigation(new Headers({ accept: "*/*" }))).toBe(false);
    expect(isBrowserNavigation(new Headers({ "sec-fetch-mode": "navigate", authorization: "Bearer x" }))).toBe(false);
  });

  it("goes to sign-in with the same path and query to come back to", () => {
    const to = signInRedirectFor("http://localhost:3000/api/v1/editions/3/pdf?format=card");
    expect(to).toBe("/sign-in?callbackUrl=%2Fapi%2Fv1%2Feditions%2F3%2Fpdf%3Fformat%3Dcard");
    expect(new URLSearchParams(to.split("?")[1]).get("callbackUrl")).toBe("/api/v1/editions/3/pdf?format=card");
  });
});
