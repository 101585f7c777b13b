import { describe, expect, it } from "vitest";
import { formatCalendarDay, formatInZone } from "./format-in-zone";

// Offsets from the IANA tz database as ICU applies them: 13:12 UTC on 4 Nov 2026 is 07:12 in
// Chicago (CST, UTC−6, after the first Sunday in November) and 14:12 in Berlin (CET, UTC+1).
const AT = "2026-11-04T13:12:30Z";

describe("formatInZone", () => {
  it("writes day month year and a 24-hour clock in the store's zone, with the zone named", () => {
    expect(formatInZone(AT, "America/Chicago")).toBe("4 Nov 2026, 07:12 GMT-6");
    expect(formatInZone(AT, "Europe/Berlin")).toBe("4 Nov 2026, 14:12 CET");
    expect(formatInZone(AT, "America/Chicago", "date")).toBe("4 Nov 2026");
    expect(formatInZone(AT, "Europe/Berlin", "time")).toBe("14:12:30");
  });

  it("keeps the calendar day of the zone, not of UTC", () => {
    // 03:00 UTC on 5 Nov is still 4 Nov in Chicago (21:00)
    expect(formatInZone("2026-11-05T03:00:00Z", "America/Chicago", "date")).toBe("4 Nov 2026");
  });

  it("never throws on bad input", () => {
    expect(formatInZone("not a date", "America/Chicago")).toBe("not a date");
    expect(formatInZone(AT, "Nowhere/Atlantis")).toBe("4 Nov 2026, 13:12 UTC");
  });
});

describe("formatCalendarDay", () => {
  it("writes a due day like every other date, whatever zone reads it", () => {
    expect(formatCalendarDay("2026-12-07")).toBe("7 Dec 2026");
    // 29 February exists in 2028 (a leap year: divisible by 4, not a century; Gregorian calendar rule).
    expect(formatCalendarDay("2028-02-29")).toBe("29 Feb 2028");
  });

  it("leaves anything that is not a calendar day as it is", () => {
    expect(formatCalendarDay("soon")).toBe("soon");
    expect(formatCalendarDay("2026-12-07T10:00:00Z")).toBe("2026-12-07T10:00:00Z");
  });
});
