import { describe, expect, it } from "vitest";
import { addDays, addMonths, daysBetween, isLeapYear, parseIsoDate } from "./calendar-date";
import { assertTimeZone, endOfLocalDay, localDateOf, startOfLocalDay, zoneOffsetMs } from "./time-zone";

describe("calendar dates", () => {
  it("knows the Gregorian leap years", () => {
    // Gregorian rule (every 4th year, not centuries unless divisible by 400).
    expect([2024, 2028, 2000].map(isLeapYear)).toEqual([true, true, true]);
    expect([2026, 2100, 1900].map(isLeapYear)).toEqual([false, false, false]);
  });
  it("adds days across month ends and leap days", () => {
    expect(addDays("2026-01-31", 1)).toBe("2026-02-01");
    expect(addDays("2026-02-28", 1)).toBe("2026-03-01");
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
    expect(addDays("2026-12-31", 1)).toBe("2027-01-01");
    expect(addDays("2026-03-01", -1)).toBe("2026-02-28");
  });
  it("counts days, 365 in a common year and 366 across a leap day", () => {
    expect(daysBetween("2026-01-01", "2027-01-01")).toBe(365);
    expect(daysBetween("2028-01-01", "2029-01-01")).toBe(366);
    expect(daysBetween("2026-03-31", "2026-03-01")).toBe(-30);
  });
  it("adds months clamping to the month end", () => {
    expect(addMonths("2026-01-31", 1)).toBe("2026-02-28");
    expect(addMonths("2028-01-31", 1)).toBe("2028-02-29");
    expect(addMonths("2028-02-29", 12)).toBe("2029-02-28");
    expect(addMonths("2026-08-31", 6)).toBe("2027-02-28");
    expect(addMonths("2026-11-15", 3)).toBe("2027-02-15");
    expect(addMonths("2026-03-31", -1)).toBe("2026-02-28");
  });
  it("refuses dates that do not exist", () => {
    expect(() => parseIsoDate("2026-02-29", "repairedOn")).toThrow(/^repairedOn: 2026-02-29 does not exist/);
    expect(() => parseIsoDate("2026-13-01")).toThrow(/no month 13/);
    expect(() => parseIsoDate("1/2/2026")).toThrow(/YYYY-MM-DD/);
  });
});

describe("time zones (IANA tz database via Intl)", () => {
  it("gives the store's date of an instant", () => {
    const instant = new Date("2027-01-01T03:00:00Z");
    expect(localDateOf(instant, "America/New_York")).toBe("2026-12-31"); // UTC−5 in winter
    expect(localDateOf(instant, "Europe/Berlin")).toBe("2027-01-01"); // UTC+1
    expect(localDateOf(new Date("2026-06-30T23:30:00Z"), "Pacific/Auckland")).toBe("2026-07-01"); // UTC+12
  });
  it("follows daylight saving time", () => {
    // US DST 2026: starts Sun 8 Mar, ends Sun 1 Nov (Energy Policy Act of 2005 rule).
    expect(zoneOffsetMs(new Date("2026-01-15T12:00:00Z"), "America/New_York")).toBe(-5 * 3600_000);
    expect(zoneOffsetMs(new Date("2026-07-15T12:00:00Z"), "America/New_York")).toBe(-4 * 3600_000);
    expect(startOfLocalDay("2026-03-08", "America/New_York").toISOString()).toBe("2026-03-08T05:00:00.000Z");
    // The DST-start day has 23 hours, the DST-end day 25.
    expect(
      endOfLocalDay("2026-03-08", "America/New_York").getTime() -
        startOfLocalDay("2026-03-08", "America/New_York").getTime(),
    ).toBe(23 * 3600_000);
    expect(
      endOfLocalDay("2026-11-01", "America/New_York").getTime() -
        startOfLocalDay("2026-11-01", "America/New_York").getTime(),
    ).toBe(25 * 3600_000);
  });
  it("refuses unknown zones by name", () => {
    expect(() => assertTimeZone("Mars/Olympus", "store.timeZone")).toThrow(
      /^store.timeZone: is not a known IANA time zone/,
    );
    expect(() => localDateOf(new Date(Number.NaN), "UTC")).toThrow(/valid Date/);
  });
});
