import { describe, expect, it } from "vitest";
import { nextActions, transition, type LifecycleEvent } from "./lifecycle";
import { findingStateWords, leftServiceDayError } from "./left-service";

const confirmed: LifecycleEvent[] = [
  { kind: "found", status: "suspected", on: "2026-03-02" },
  { kind: "confirmed", status: "confirmed", on: "2026-03-03" },
];
const repaired: LifecycleEvent[] = [...confirmed, { kind: "repaired", status: "repaired", on: "2026-03-10" }];
const RETIRED = "2026-04-30";

// 40 CFR 82.157 / 84.106: where a repair fails, a plan to retrofit or retire the appliance is owed
// within 30 days and carried out within a year (docs/reference/standards.md §1, from memory [M]):
// retirement is the rule's own way out of a repair, so a leak on a retired system owes no more repair
// or verification test. EU 2024/573: leak checks and the re-check concern equipment that holds the
// gas (§2, from memory for the wording); a system out of service holds none.
describe("closing a finding because its system left service (docs/decisions/0166)", () => {
  it("is refused while the system is in service, with the reason", () => {
    expect(transition(confirmed, "close-left-service")).toEqual({
      ok: false,
      message:
        "This finding is confirmed: its system is in service; a finding closes this way only once its system has been retired.",
    });
    expect(nextActions(confirmed)).not.toContain("close-left-service");
  });

  it("closes a suspected, confirmed or repaired-but-unverified finding once the system is retired, offered first", () => {
    for (const events of [confirmed.slice(0, 1), confirmed, repaired]) {
      expect(transition(events, "close-left-service", undefined, undefined, RETIRED)).toEqual({
        ok: true,
        kind: "closed-left-service",
        status: "closed",
      });
      expect(nextActions(events, undefined, RETIRED)[0]).toBe("close-left-service");
    }
    // A repaired finding with a passed initial test only (no follow-up yet) is still unverified.
    const half: LifecycleEvent[] = [
      ...repaired,
      { kind: "initial-test", status: "repaired", on: "2026-03-10", result: "passed" },
    ];
    expect(nextActions(half, undefined, RETIRED)).toEqual(["close-left-service", "follow-up-test"]);
  });

  it("leaves a verified repair to close as verified, and a closed or dismissed finding alone", () => {
    const verified: LifecycleEvent[] = [
      ...repaired,
      { kind: "initial-test", status: "repaired", on: "2026-03-10", result: "passed" },
      { kind: "follow-up-test", status: "verified", on: "2026-03-18", result: "passed" },
    ];
    expect(nextActions(verified, undefined, RETIRED)).toEqual(["close"]);
    expect(transition(verified, "close-left-service", undefined, undefined, RETIRED)).toMatchObject({
      ok: false,
      message: "This finding is verified: its repair is verified, so close it as verified (Close the finding).",
    });
    const closed: LifecycleEvent[] = [...verified, { kind: "closed", status: "closed", on: "2026-03-20" }];
    expect(transition(closed, "close-left-service", undefined, undefined, RETIRED).ok).toBe(false);
    const dismissed: LifecycleEvent[] = [...confirmed, { kind: "dismissed", status: "dismissed", on: "2026-03-04" }];
    expect(nextActions(dismissed, undefined, RETIRED)).toEqual([]);
  });

  it("under EU rules closes a repair without its clean re-check, but not one the re-check verified ([S:E6])", () => {
    expect(nextActions(repaired, { by: "recheck", cleanChecksOn: [] }, RETIRED)).toEqual(["close-left-service"]);
    expect(nextActions(repaired, { by: "recheck", cleanChecksOn: ["2026-03-20"] }, RETIRED)).toEqual(["close"]);
  });
});

describe("the day of a step on a finding whose system left service", () => {
  const rack = { name: "Rack C", retiredOn: RETIRED };

  it("dates the closing on or after the retirement day, naming the day otherwise", () => {
    expect(leftServiceDayError("close-left-service", "2026-04-29", rack)).toBe(
      "must not be before 30 Apr 2026, the day Rack C left service",
    );
    expect(leftServiceDayError("close-left-service", RETIRED, rack)).toBeNull();
    expect(leftServiceDayError("close-left-service", "2026-06-01", rack)).toBeNull();
  });

  it("refuses any other step dated after the retirement day, and takes one dated by then (docs/decisions/0124)", () => {
    for (const action of ["confirm", "repair", "initial-test", "follow-up-test", "dismiss"] as const)
      expect(leftServiceDayError(action, "2026-05-01", rack)).toBe(
        "must not be after 30 Apr 2026, the day Rack C left service: record a step taken by then, or close the finding because the system left service",
      );
    expect(leftServiceDayError("close", "2026-05-01", rack)).toBe(
      "must not be after 30 Apr 2026, the day Rack C left service: date the closing of the verified repair by then",
    );
    expect(leftServiceDayError("repair", RETIRED, rack)).toBeNull();
    expect(leftServiceDayError("repair", "2026-05-01", { name: "Rack C", retiredOn: null })).toBeNull();
  });
});

describe("a finding's state in words", () => {
  it("says a finding was closed because its system left service, and that an open one still needs closing", () => {
    const closedLeft = [...confirmed, { kind: "closed-left-service" as const }];
    expect(findingStateWords({ status: "closed", events: closedLeft, systemRetiredOn: RETIRED })).toBe(
      "closed: the system left service on 30 Apr 2026",
    );
    expect(findingStateWords({ status: "confirmed", events: confirmed, systemRetiredOn: RETIRED })).toBe(
      "confirmed; the system left service on 30 Apr 2026: to be closed",
    );
    expect(findingStateWords({ status: "confirmed", events: confirmed, systemRetiredOn: null })).toBe("confirmed");
    expect(findingStateWords({ status: "closed", events: [{ kind: "closed" }], systemRetiredOn: RETIRED })).toBe(
      "closed",
    );
  });
});
