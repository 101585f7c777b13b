import { describe, expect, it } from "vitest";
import { readableAuditEntry, readableDays } from "./audit-entry";

describe("readableAuditEntry", () => {
  it("writes the moment on the store's clock with its zone, not the UTC instant", () => {
    // 03:10 UTC on 17 Feb is 22:10 on 16 Feb in New York (EST, UTC−5; IANA tz database).
    const e = readableAuditEntry(
      {
        at: "2026-02-17T03:10:00.000Z",
        by: "Dana Ortiz",
        summary: "Retrofit from 2026-02-16: refrigerant R-22 → R-448A",
      },
      "America/New_York",
    );
    expect(e).toEqual({
      when: "16 Feb 2026, 22:10 GMT-5",
      by: "Dana Ortiz",
      summary: "Retrofit from 16 Feb 2026: refrigerant R-22 → R-448A",
    });
  });

  it("follows the zone's daylight-saving change", () => {
    // US daylight saving starts at 02:00 local on the second Sunday of March (15 U.S.C. 260a): 8 Mar 2026,
    // 07:00 UTC. Half an hour either side reads 01:30 EST and 03:30 EDT.
    expect(readableAuditEntry({ at: "2026-03-08T06:30:00Z", by: "", summary: "" }, "America/New_York").when).toBe(
      "8 Mar 2026, 01:30 GMT-5",
    );
    expect(readableAuditEntry({ at: "2026-03-08T07:30:00Z", by: "", summary: "" }, "America/New_York").when).toBe(
      "8 Mar 2026, 03:30 GMT-4",
    );
    // Central European Time is UTC+1 in winter (Europe/Berlin).
    expect(readableAuditEntry({ at: "2026-12-05T09:00:00Z", by: "", summary: "" }, "Europe/Berlin").when).toBe(
      "5 Dec 2026, 10:00 CET",
    );
  });
});

describe("readableDays", () => {
  it("writes every ISO day in a stored summary as the records write days", () => {
    expect(readableDays("Chronic-leaker report for 2026 marked filed on 2027-01-15 (reference EPA-77)")).toBe(
      "Chronic-leaker report for 2026 marked filed on 15 Jan 2027 (reference EPA-77)",
    );
    expect(readableDays("Change from 2026-03-01 to 2026-04-02")).toBe("Change from 1 Mar 2026 to 2 Apr 2026");
  });

  it("leaves a day inside a longer token, a year alone and an impossible day as they are", () => {
    expect(readableDays("reference REF-2026-01-02 and 2026-01-02-A")).toBe("reference REF-2026-01-02 and 2026-01-02-A");
    expect(readableDays("report for 2026")).toBe("report for 2026");
    // 2026 is no leap year (Gregorian calendar rule): there is no 29 February.
    expect(readableDays("on 2026-02-29")).toBe("on 2026-02-29");
  });
});
