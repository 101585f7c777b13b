import { describe, expect, it } from "vitest";
import { nextActions, transition, type LifecycleEvent } from "./lifecycle";

const repaired: LifecycleEvent[] = [
  { kind: "found", status: "suspected", on: "2026-06-01" },
  { kind: "confirmed", status: "confirmed", on: "2026-06-01" },
  { kind: "repaired", status: "repaired", on: "2026-06-03" },
];

describe("finding lifecycle", () => {
  it("verifies a repair by the two verification tests under the US parts (40 CFR 82.152 [S:R8])", () => {
    expect(nextActions(repaired)).toEqual(["initial-test"]);
    expect(transition(repaired, "close").ok).toBe(false);
    const tested: LifecycleEvent[] = [
      ...repaired,
      { kind: "initial-test", status: "repaired", on: "2026-06-03", result: "passed" },
      { kind: "follow-up-test", status: "verified", on: "2026-06-20", result: "passed" },
    ];
    expect(transition(tested, "close")).toEqual({ ok: true, kind: "closed", status: "closed" });
  });

  it("under EU rules closes a repaired finding on a clean leak check on or after the repair day, never by tests (Regulation (EU) 2024/573 [S:E6])", () => {
    const before = { by: "recheck", cleanChecksOn: ["2026-05-20", "2026-06-02"] } as const;
    expect(nextActions(repaired, before)).toEqual([]);
    const refused = transition(repaired, "close", undefined, before);
    expect(refused).toEqual({
      ok: false,
      message:
        "This finding is repaired: record the leak check after the repair first (no leak found, within a month of the repair), then close it.",
    });
    expect(transition(repaired, "initial-test", "passed", before).ok).toBe(false);
    expect(transition(repaired, "follow-up-test", "passed", before).ok).toBe(false);
    // a clean check on the repair day itself counts: "on or after the repair"
    const sameDay = { by: "recheck", cleanChecksOn: ["2026-06-03"] } as const;
    expect(nextActions(repaired, sameDay)).toEqual(["close"]);
    expect(transition(repaired, "close", undefined, sameDay)).toEqual({ ok: true, kind: "closed", status: "closed" });
  });

  it("under EU rules the re-check must follow the latest repair after a leak came back", () => {
    const again: LifecycleEvent[] = [
      ...repaired,
      { kind: "confirmed", status: "confirmed", on: "2026-06-10" },
      { kind: "repaired", status: "repaired", on: "2026-06-12" },
    ];
    expect(nextActions(again, { by: "recheck", cleanChecksOn: ["2026-06-05"] })).toEqual([]);
    expect(nextActions(again, { by: "recheck", cleanChecksOn: ["2026-06-05", "2026-06-30"] })).toEqual(["close"]);
  });
});
