import { describe, expect, it } from "vitest";
import { LocatorInputError, parseLocatorInput, type LocatorInputRaw } from "./locator-input";

function good(): LocatorInputRaw {
  return {
    plan: {
      width: 20,
      height: 10,
      obstacles: [
        {
          id: "w1",
          polygon: [
            [0, 0],
            [20, 0],
            [20, 0.2],
            [0, 0.2],
          ],
        },
      ],
      fixtures: [
        {
          id: "c1",
          kind: "open-case",
          polygon: [
            [2, 2],
            [8, 2],
            [8, 3],
            [2, 3],
          ],
          fans: true,
        },
      ],
      riskPoints: [{ id: "ls1", kind: "line-set", x: 5, y: 2.5 }],
      backgroundZones: [
        {
          id: "bz1",
          polygon: [
            [15, 5],
            [18, 5],
            [18, 8],
            [15, 8],
          ],
          note: "aerosol storage",
          ppm: 3,
        },
      ],
    },
    instrument: { transportDelayS: 5, timeConstantS: 1.5, alarmPpm: 2 },
    readings: [
      { x: 1.2, y: 3.4, t: 0, ppm: 0 },
      { x: 2.5, y: 3.4, t: 4.1, ppm: 0, atLeast: false, point: "grille", note: "start" },
    ],
  };
}

/** The problems reported for an input, one line each. */
function problems(input: unknown): string[] {
  try {
    parseLocatorInput(input);
  } catch (e) {
    if (e instanceof LocatorInputError) return e.problems;
    throw e;
  }
  return [];
}

describe("locator input contract (docs/locator/command-line.md)", () => {
  it("accepts the example shape of docs/locator/command-line.md, with and without an explicit closing vertex", () => {
    expect(problems(good())).toEqual([]);
    const closed = good();
    closed.plan.obstacles![0].polygon = [
      [0, 0],
      [20, 0],
      [20, 0.2],
      [0, 0.2],
      [0, 0],
    ];
    const parsed = parseLocatorInput(closed);
    expect(parsed.plan.obstacles[0].polygon).toHaveLength(4);
    expect(parsed.plan.fixtures[0].fans).toBe(true);
  });

  it("rejects empty readings", () => {
    const x = good();
    x.readings = [];
    expect(problems(x)).toEqual(["readings: readings must not be empty"]);
  });

  it("rejects NaN and negative ppm, naming the reading", () => {
    const x = good();
    x.readings[1].ppm = NaN;
    expect(problems(x)).toEqual(["readings[1].ppm: ppm must be a number, not NaN"]);
    x.readings[1].ppm = -1;
    expect(problems(x)).toEqual(["readings[1].ppm: ppm must not be negative"]);
  });

  it("rejects times going backwards", () => {
    const x = good();
    x.readings.push({ x: 3, y: 3, t: 4.1, ppm: 1 }); // equal times are allowed (two taps in one second)
    expect(problems(x)).toEqual([]);
    const y = good();
    y.readings.push({ x: 3, y: 3, t: 2, ppm: 1 });
    expect(problems(y)).toEqual([
      "readings[2].t: time goes backwards: 2 s after 4.1 s (readings must be in time order)",
    ]);
  });

  it("accepts pinpoint passes and names what is wrong with one", () => {
    const x = good();
    x.passes = [{ id: "p2", fans: "stopped", fixture: "c1" }];
    x.readings.push({ x: 3, y: 3, t: 9, ppm: 4, pass: "p2" });
    expect(problems(x)).toEqual([]);
    expect(parseLocatorInput(x).passes).toEqual([{ id: "p2", fans: "stopped", defrost: false, fixture: "c1" }]);
    const y = good();
    y.passes = [
      { id: "p2", fans: "idle" as "stopped" },
      { id: "p2", fans: "running", defrost: true, fixture: "nowhere" },
    ];
    y.readings.push({ x: 3, y: 3, t: 9, ppm: 4, pass: "p9" });
    expect(problems(y)).toEqual(["passes[0].fans: fans must be running or stopped"]);
    y.passes[0].fans = "stopped";
    expect(problems(y)).toEqual([
      'passes[1].id: pass id "p2" is used twice',
      'passes[1].fixture: fixture "nowhere" is not a fixture of the plan',
      'readings[2].pass: pass "p9" is not in passes',
    ]);
  });

  it("rejects readings outside the plan", () => {
    const x = good();
    x.readings[0].x = 21;
    expect(problems(x)).toEqual(["readings[0]: reading at (21, 3.4) lies outside the 20 m x 10 m plan"]);
  });

  it("rejects polygons that do not close or have fewer than 3 points", () => {
    const a = good();
    a.plan.fixtures![0].polygon = [
      [2, 2],
      [8, 2],
    ];
    expect(problems(a)).toEqual(["plan.fixtures[0].polygon: polygon needs at least 3 distinct vertices, got 2"]);
    const b = good();
    b.plan.obstacles![0].polygon = [
      [0, 0],
      [5, 0],
      [10, 0],
    ];
    expect(problems(b)[0]).toMatch(/^plan\.obstacles\[0\]\.polygon: polygon does not close around any area/);
    const c = good();
    c.plan.backgroundZones![0].polygon = [
      [15, 5],
      [18, 8],
      [18, 5],
      [15, 9],
    ];
    expect(problems(c)[0]).toMatch(
      /^plan\.backgroundZones\[0\]\.polygon: polygon does not close into a simple outline/,
    );
  });

  it("rejects a grid that would exceed the memory budget", () => {
    const x = good();
    x.plan.width = 600;
    x.plan.height = 400;
    expect(problems(x)[0]).toMatch(
      /^plan\.width: a 600 m x 400 m plan needs 3840000 cells at 0\.25 m, over the memory budget/,
    );
  });

  it("names unknown kinds and bad instrument settings", () => {
    const x = good();
    (x.plan.fixtures![0] as { kind: string }).kind = "freezer";
    x.instrument.alarmPpm = 0;
    expect(problems(x)).toEqual([
      "plan.fixtures[0].kind: kind must be one of open-case, island-case, door-case, walk-in, machine-room",
      "instrument.alarmPpm: alarmPpm must be positive",
    ]);
  });
});
