import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { readingAir, stillsAir } from "./pass-air";

const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

const input = (passes: unknown[], pass: (i: number) => string | undefined) =>
  parseLocatorInput({
    plan: {
      width: 20,
      height: 6,
      fixtures: [
        { id: "a", kind: "open-case", polygon: rect(1, 0, 9, 1), fans: true },
        { id: "b", kind: "open-case", polygon: rect(11, 0, 19, 1), fans: true },
        { id: "c", kind: "door-case", polygon: rect(1, 5, 9, 6), fans: false },
      ],
    },
    instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
    readings: Array.from({ length: 6 }, (_, i) => ({ x: i + 1, y: 2, t: i, ppm: 1, pass: pass(i) })),
    passes,
  });

describe("the air of each reading", () => {
  it("stills the air with the fans stopped or in a defrost", () => {
    expect(stillsAir({ fans: "stopped", defrost: false })).toBe(true);
    expect(stillsAir({ fans: "running", defrost: true })).toBe(true);
    expect(stillsAir({ fans: "running", defrost: false })).toBe(false);
  });

  it("gives a pass over one fixture a model where only that fixture's fans are stopped", () => {
    const air = readingAir(input([{ id: "p", fans: "stopped", fixture: "a" }], (i) => (i >= 3 ? "p" : undefined)));
    expect(air.models).toHaveLength(2);
    expect(air.models[1].map((f) => f.fans)).toEqual([false, true, false]);
    expect(Array.from(air.modelOfReading)).toEqual([0, 0, 0, 1, 1, 1]);
  });

  it("stills every fixture for a pass over the whole store, and shares model 0 for passes that change nothing", () => {
    const air = readingAir(
      input(
        [
          { id: "run", fans: "running" },
          { id: "all", fans: "running", defrost: true },
        ],
        (i) => (i < 2 ? undefined : i < 4 ? "run" : "all"),
      ),
    );
    expect(air.models).toHaveLength(2);
    expect(air.models[1].every((f) => !f.fans)).toBe(true);
    expect(Array.from(air.modelOfReading)).toEqual([0, 0, 0, 0, 1, 1]);
  });
});
