import { describe, expect, it } from "vitest";
import { passNumberOf, sweepConditionsWords } from "./pass-words";

const name = (id: string) => (id === "f1" ? "Dairy 1" : "?");
const time = (d: Date) => d.toISOString().slice(11, 16);

describe("the words for a sweep's passes", () => {
  it("says the sweep's own conditions alone when it has no pinpoint pass", () => {
    expect(sweepConditionsWords({ fans: "running", defrost: false }, [], name, time)).toBe("fans running");
  });

  it("numbers pinpoint passes from 2 with their air, place and times", () => {
    const passes = [
      {
        id: "p2",
        fans: "stopped" as const,
        defrost: false,
        fixtureId: "f1",
        startedAt: new Date("2026-11-02T14:10:00Z"),
        endedAt: new Date("2026-11-02T14:31:00Z"),
      },
      {
        id: "p3",
        fans: "running" as const,
        defrost: true,
        fixtureId: null,
        startedAt: new Date("2026-11-02T14:40:00Z"),
        endedAt: null,
      },
    ];
    expect(sweepConditionsWords({ fans: "running", defrost: false }, passes, name, time)).toBe(
      "pass 1: fans running; pass 2: fans stopped at Dairy 1, 14:10–14:31; pass 3: in defrost, whole store, 14:40–not ended",
    );
    const number = passNumberOf(passes);
    expect([number(null), number("p2"), number("p3"), number("unknown")]).toEqual([1, 2, 3, 1]);
  });
});
