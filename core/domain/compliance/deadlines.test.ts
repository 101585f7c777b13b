import { describe, expect, it } from "vitest";
import {
  chronicReportDueDate,
  dueStatus,
  followUpVerificationDueDate,
  initialVerificationDueDate,
  keepRecordsUntil,
  recheckAfterRepairDueDate,
  repairDueDate,
} from "./deadlines";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { PART_82_SUBPART_F, PART_84_SUBPART_C, US_FEDERAL_PROFILE } from "./us-federal-profile";
import { localDateOf } from "../dates/time-zone";

describe("deadlines", () => {
  it("repair due 30 days after learning, across month ends and leap years", () => {
    // [S:R4]: repair within 30 days.
    expect(repairDueDate(PART_82_SUBPART_F, "2026-01-15")).toBe("2026-02-14");
    expect(repairDueDate(PART_82_SUBPART_F, "2026-02-10")).toBe("2026-03-12"); // February 2026 has 28 days
    expect(repairDueDate(PART_82_SUBPART_F, "2028-02-10")).toBe("2028-03-11"); // February 2028 has 29
    expect(repairDueDate(PART_82_SUBPART_F, "2026-12-15")).toBe("2027-01-14");
  });
  it("follow-up verification 10 days after the initial test", () => {
    // docs/reference/standards.md §1 [M]: follow-up within 10 days.
    expect(followUpVerificationDueDate(PART_82_SUBPART_F, "2026-12-25")).toBe("2027-01-04");
  });
  it("chronic-leaker report by 1 March of the next year", () => {
    // [S:R7].
    expect(chronicReportDueDate(PART_82_SUBPART_F, 2027)).toBe("2028-03-01");
  });
  it("EU re-check within a month of the repair", () => {
    // [S:E6]: within 1 month; 31 Jan + 1 month clamps to the end of February.
    expect(recheckAfterRepairDueDate(EU_FGAS_PROFILE, "2026-01-31")).toBe("2026-02-28");
    expect(recheckAfterRepairDueDate(EU_FGAS_PROFILE, "2028-01-31")).toBe("2028-02-29");
    expect(() => recheckAfterRepairDueDate(US_FEDERAL_PROFILE, "2026-01-31")).toThrow(/^profile:/);
  });
  it("keeps records 3 years (US) and 5 years (EU)", () => {
    // [S:R6,R7] 3 years; [S:E8b] 5 years.
    expect(keepRecordsUntil(US_FEDERAL_PROFILE, "2026-02-28")).toBe("2029-02-28");
    expect(keepRecordsUntil(EU_FGAS_PROFILE, "2028-02-29")).toBe("2033-02-28");
  });
  it("judges due and overdue on the store's calendar", () => {
    // IANA tz: 06:00 UTC on 1 Apr 2026 is 23:00 on 31 Mar in Los Angeles (PDT, UTC−7) and 08:00 on 1 Apr in Berlin (CEST).
    const now = new Date("2026-04-01T06:00:00Z");
    expect(dueStatus("2026-03-31", now, "America/Los_Angeles")).toEqual({ daysLeft: 0, state: "due-today" });
    expect(dueStatus("2026-03-31", now, "Europe/Berlin")).toEqual({ daysLeft: -1, state: "overdue" });
    expect(dueStatus("2026-04-08", now, "Europe/Berlin")).toEqual({ daysLeft: 7, state: "due-soon" });
    expect(dueStatus("2026-04-09", now, "Europe/Berlin").state).toBe("upcoming");
    expect(() => dueStatus("2026-04-09", now, "Nowhere/Atlantis")).toThrow(/^timeZone: is not a known IANA time zone/);
  });
});

describe("verification tests after a repair", () => {
  it("initial test on the repair day, follow-up 10 days after it, across month ends and leap days", () => {
    // [S:R8]: the initial verification test follows the repair "as soon as practicable", so it is due on the repair day.
    expect(initialVerificationDueDate(PART_84_SUBPART_C, "2026-01-31")).toBe("2026-01-31");
    // docs/reference/standards.md §1 [M]: the follow-up within 10 days of the initial test.
    expect(followUpVerificationDueDate(PART_84_SUBPART_C, "2026-01-25")).toBe("2026-02-04");
    expect(followUpVerificationDueDate(PART_84_SUBPART_C, "2028-02-25")).toBe("2028-03-06"); // 2028 is a leap year: 29 Feb counts
    expect(followUpVerificationDueDate(PART_84_SUBPART_C, "2026-02-25")).toBe("2026-03-07");
  });
  it("uses the store's calendar day of the repair", () => {
    // IANA tz: 03:30 UTC on 1 Mar 2028 is 19:30 on 29 Feb in Los Angeles (PST, UTC−8) and 04:30 on 1 Mar in Berlin (CET).
    const at = new Date("2028-03-01T03:30:00Z");
    expect(initialVerificationDueDate(PART_84_SUBPART_C, localDateOf(at, "America/Los_Angeles"))).toBe("2028-02-29");
    expect(followUpVerificationDueDate(PART_84_SUBPART_C, localDateOf(at, "America/Los_Angeles"))).toBe("2028-03-10");
    expect(followUpVerificationDueDate(PART_84_SUBPART_C, localDateOf(at, "Europe/Berlin"))).toBe("2028-03-11");
  });
});
