/**
 * The one way Plumeline writes a moment: in the store's time zone, day month year, 24-hour clock,
 * the zone named: "4 Nov 2026, 07:12 GMT-6". Screens, PDFs and e-mails all use it, so a time
 * reads the same wherever it is shown (docs/product.md: times are shown in the store's zone).
 */
export type MomentStyle = "date" | "dateTime" | "time";

const OPTIONS: Record<MomentStyle, Intl.DateTimeFormatOptions> = {
  date: { day: "numeric", month: "short", year: "numeric" },
  dateTime: {
    day: "numeric",
    month: "short",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    timeZoneName: "short",
  },
  time: { hour: "2-digit", minute: "2-digit", second: "2-digit", hourCycle: "h23" },
};

const cache = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string, style: MomentStyle): Intl.DateTimeFormat {
  const key = `${timeZone}|${style}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat("en-GB", { ...OPTIONS[style], timeZone });
    cache.set(key, f);
  }
  return f;
}

/** `at` in `timeZone`; an unparseable moment is returned as given, an unknown zone falls back to UTC. */
export function formatInZone(at: Date | string, timeZone: string, style: MomentStyle = "dateTime"): string {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) return String(at);
  try {
    return formatter(timeZone, style).format(date);
  } catch {
    return formatter("UTC", style).format(date);
  }
}

/**
 * A calendar day ("2026-12-07": a due date, the day a charge was added) written like every other
 * date: "7 Dec 2026". A calendar day has no zone of its own: it is already the store's day, so it is
 * read as that day at noon UTC and written in UTC. No day is "—"; anything else is returned as given.
 */
export function formatCalendarDay(day: string | null): string {
  if (day === null) return "—";
  if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return day;
  return formatInZone(`${day}T12:00:00Z`, "UTC", "date");
}
