import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, isTimeZone, nextDay, zonedDayStart } from "@/lib/format/dates";
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
  it("reads UTC without zone rules exactly as an Intl formatter for UTC does", () => {
    // Independent reference: the runtime's ICU data for Swedish, whose dates and times read in
    // ISO 8601 order ("2026-12-02 14:05:00"), in the UTC zone.
    const reference = (d: Date) => d.toLocaleString("sv-SE", { timeZone: "UTC" }).slice(0, 16);
    const instants = [
      Date.UTC(2026, 11, 2, 0, 0),
      Date.UTC(2026, 11, 31, 23, 59, 59, 999),
      Date.UTC(2024, 1, 29, 12, 30),
      Date.UTC(1999, 0, 1, 0, 0, 30),
      Date.UTC(2038, 0, 19, 3, 14, 7),
    ];
    for (let t = Date.UTC(2020, 0, 1); t < Date.UTC(2031, 0, 1); t += 7_777_777_777) instants.push(t);
    for (const t of instants) {
      const d = new Date(t);
      expect(formatDateTime(d, "UTC")).toBe(reference(d));
      expect(formatDate(d)).toBe(reference(d).slice(0, 10));
    }
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

describe("where a lab's calendar day begins", () => {
  // Offsets from the IANA tz database (from memory): Kolkata UTC+5:30 and Kathmandu UTC+5:45 all
  // year; New York UTC-5, UTC-4 from 2026-03-08 02:00 local; London UTC+0, UTC+1 from 2026-03-29
  // 01:00 UTC; Kiritimati UTC+14.
  it("is local midnight, as an instant", () => {
    expect(zonedDayStart("2026-12-02", "UTC").toISOString()).toBe("2026-12-02T00:00:00.000Z");
    expect(zonedDayStart("2026-01-15", "Asia/Kolkata").toISOString()).toBe("2026-01-14T18:30:00.000Z");
    expect(zonedDayStart("2026-01-15", "Asia/Kathmandu").toISOString()).toBe("2026-01-14T18:15:00.000Z");
    expect(zonedDayStart("2026-07-01", "America/New_York").toISOString()).toBe("2026-07-01T04:00:00.000Z");
    expect(zonedDayStart("2026-12-03", "Pacific/Kiritimati").toISOString()).toBe("2026-12-02T10:00:00.000Z");
  });

  it("follows a daylight-saving change between UTC midnight and local midnight", () => {
    // The day DST starts still begins on standard time; the next one on summer time.
    expect(zonedDayStart("2026-03-08", "America/New_York").toISOString()).toBe("2026-03-08T05:00:00.000Z");
    expect(zonedDayStart("2026-03-09", "America/New_York").toISOString()).toBe("2026-03-09T04:00:00.000Z");
    expect(zonedDayStart("2026-03-29", "Europe/London").toISOString()).toBe("2026-03-29T00:00:00.000Z");
    expect(zonedDayStart("2026-03-30", "Europe/London").toISOString()).toBe("2026-03-29T23:00:00.000Z");
  });

  it("agrees with formatDate: the instant is that day there, a minute before is the day before", () => {
    for (const tz of [
      "UTC",
      "Asia/Kolkata",
      "America/New_York",
      "Europe/London",
      "Pacific/Kiritimati",
      "Pacific/Auckland",
    ])
      for (const day of [
        "2026-01-01",
        "2026-03-08",
        "2026-03-29",
        "2026-04-05",
        "2026-09-27",
        "2026-11-01",
        "2026-12-31",
      ]) {
        const start = zonedDayStart(day, tz);
        expect(formatDate(start, tz), `${tz} ${day}`).toBe(day);
        expect(formatDate(new Date(start.getTime() - 60_000), tz), `${tz} ${day}`).not.toBe(day);
      }
  });

  it("counts calendar days across months and years", () => {
    expect(nextDay("2026-02-28")).toBe("2026-03-01");
    expect(nextDay("2028-02-28")).toBe("2028-02-29");
    expect(nextDay("2026-12-31")).toBe("2027-01-01");
  });
});
