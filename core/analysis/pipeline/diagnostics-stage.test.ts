import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { locate } from "../locate";

describe("diagnostics stage (through locate)", () => {
  const input = parseLocatorInput({
    plan: { width: 12, height: 4 },
    instrument: { transportDelayS: 2, timeConstantS: 0.5, alarmPpm: 2 },
    readings: [
      { x: 0.5, y: 2, t: 0, ppm: 1 },
      { x: 1.5, y: 2, t: 1, ppm: 1 },
      { x: 2.5, y: 2, t: 2, ppm: 1 },
      { x: 3.5, y: 2, t: 3, ppm: 250, atLeast: true },
      { x: 9.5, y: 2, t: 9, ppm: 1 },
    ],
  });
  const r = locate(input);
  const kinds = r.diagnostics.map((d) => d.kind);

  it("reports readings taken before one delay, over-range readings and a gap between taps", () => {
    expect(kinds).toContain("early-readings");
    expect(r.diagnostics.find((d) => d.kind === "early-readings")).toEqual({
      kind: "early-readings",
      count: 3,
      shiftS: 2.5,
    });
    expect(r.diagnostics.find((d) => d.kind === "over-range")).toEqual({ kind: "over-range", count: 1 });
    // the gap between the taps at x 3.5 and 9.5 m, centred at 6.5 m
    expect(r.diagnostics.find((d) => d.kind === "sparse-coverage")).toEqual({
      kind: "sparse-coverage",
      count: 1,
      gapM: 3,
      longestM: 6,
      at: { x: 6.5, y: 2 },
    });
  });

  it("flags each corrected reading", () => {
    expect(r.readings.map((c) => c.flags.includes("before-delay"))).toEqual([true, true, true, false, false]);
    expect(r.readings[3].flags).toContain("over-range");
    expect(r.readings[3].corrected).toEqual({ x: 1, y: 2 }); // back 2.5 s at 1 m/s
  });

  it("states the delay it assumed", () => {
    expect(r.assumptions.shiftS).toBe(2.5);
  });
});
