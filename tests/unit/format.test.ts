import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, isTimeZone } from "@/lib/format/dates";
import { formatDecimal } from "@/lib/format/numbers";

describe("dates in the lab's time zone (ISO 8601 order)", () => {
  // 2026-12-01 23:30 UTC is already 2 December in Sydney (UTC+11 in December, from the IANA tz database).
  const late = new Date(Date.UTC(2026, 11, 1, 23, 30));
  it("shows the calendar date of the lab, not of the server", () => {
    expect(formatDate(late, "UTC")).toBe("2026-12-01");
    expect(formatDate(late, "Australia/Sydney")).toBe("2026-12-02");
    expect(formatDateTime(late, "America/New_York")).toBe("2026-12-01 18:30");
    expect(formatDateTime(new Date(Date.UTC(2026, 0, 5, 0, 5)), "UTC")).toBe("2026-01-05 00:05");
  });
  it("knows IANA names and refuses others", () => {
    expect(isTimeZone("Europe/Berlin")).toBe(true);
    expect(isTimeZone("Mars/Olympus")).toBe(false);
    expect(isTimeZone("")).toBe(false);
  });
});

describe("decimal separator", () => {
  it("prints the lab's choice", () => {
    expect(formatDecimal(3.25, 2)).toBe("3.25");
    expect(formatDecimal(3.25, 2, "comma")).toBe("3,25");
    expect(formatDecimal(12, 1, "comma")).toBe("12,0");
  });
});
