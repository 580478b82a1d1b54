/**
 * The one date format on pages, posters and mail: ISO 8601 calendar dates (2026-12-02) and
 * 24-hour times (14:05), shown in the lab's IANA time zone (labs.time_zone). Year-month-day is
 * the order ISO 8601 prescribes and cannot be misread as day-month or month-day.
 */
export const DEFAULT_TIME_ZONE = "UTC";

/** True when the runtime's time-zone database knows the IANA name. */
export function isTimeZone(name: string): boolean {
  if (typeof name !== "string" || name.length === 0 || name.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

// Building an Intl formatter loads the zone's rules: one per zone, kept (a few zones per server).
const formatters = new Map<string, Intl.DateTimeFormat>();

function parts(date: Date, timeZone: string) {
  // UTC needs no zone rules: read the ISO form (four-digit years), and skip building a formatter
  // (the first Intl formatter of a process costs a poster render about 10 ms).
  const year = date.getUTCFullYear();
  if (timeZone === DEFAULT_TIME_ZONE && year >= 1000 && year <= 9999) {
    const iso = date.toISOString();
    return {
      year: iso.slice(0, 4),
      month: iso.slice(5, 7),
      day: iso.slice(8, 10),
      hour: iso.slice(11, 13),
      minute: iso.slice(14, 16),
    };
  }
  let fmt = formatters.get(timeZone);
  if (!fmt) {
    fmt = new Intl.DateTimeFormat("en-US", {
      timeZone,
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      hourCycle: "h23",
    });
    formatters.set(timeZone, fmt);
  }
  const out: Record<string, string> = {};
  for (const p of fmt.formatToParts(date)) out[p.type] = p.value;
  return out as { year: string; month: string; day: string; hour: string; minute: string };
}

/** 2026-12-02 */
export function formatDate(date: Date, timeZone: string = DEFAULT_TIME_ZONE): string {
  const p = parts(date, timeZone);
  return `${p.year}-${p.month}-${p.day}`;
}

/** 2026-12-02 14:05 */
export function formatDateTime(date: Date, timeZone: string = DEFAULT_TIME_ZONE): string {
  const p = parts(date, timeZone);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}`;
}

/** Minutes east of UTC that `timeZone`'s clocks read at the instant `t` (ms). */
function offsetMinutes(t: number, timeZone: string): number {
  const p = parts(new Date(t), timeZone);
  const wall = Date.UTC(Number(p.year), Number(p.month) - 1, Number(p.day), Number(p.hour), Number(p.minute));
  return Math.round((wall - Math.floor(t / 60_000) * 60_000) / 60_000);
}

/**
 * The instant the calendar day `day` (YYYY-MM-DD) begins in `timeZone`: its local midnight, or
 * the first minute after it when clocks skip midnight. Two passes, so a change of offset
 * between UTC midnight and local midnight (a daylight-saving day) is accounted for.
 */
export function zonedDayStart(day: string, timeZone: string = DEFAULT_TIME_ZONE): Date {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  const utcMidnight = Date.UTC(y, m - 1, d);
  let t = utcMidnight - offsetMinutes(utcMidnight, timeZone) * 60_000;
  t = utcMidnight - offsetMinutes(t, timeZone) * 60_000;
  return new Date(t);
}

/** The calendar day after `day` (YYYY-MM-DD). */
export function nextDay(day: string): string {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}
