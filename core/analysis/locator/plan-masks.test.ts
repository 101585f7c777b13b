import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { cellIndexOf, createPlanGrid } from "../grid/plan-grid";
import { casesRunFans, driftTrials, equipmentMask, fanStepScale, riskPointPrior } from "./plan-masks";

const plan = (fixtures: unknown[], riskPoints: unknown[]) =>
  parseLocatorInput({
    plan: { width: 10, height: 6, fixtures, riskPoints },
    instrument: { transportDelayS: 5, timeConstantS: 1, alarmPpm: 2 },
    readings: [{ x: 1, y: 1, t: 0, ppm: 0 }],
  }).plan;

describe("plan-derived masks", () => {
  const grid = createPlanGrid(10, 6, 0.25, []);
  const at = (x: number, y: number) => cellIndexOf(grid, x, y);

  it("allows suspect spots inside fixtures, within the margin of their outline and near risk points only", () => {
    const p = plan(
      [
        {
          id: "c1",
          kind: "open-case",
          polygon: [
            [2, 2],
            [6, 2],
            [6, 3],
            [2, 3],
          ],
        },
      ],
      [{ id: "ls1", kind: "line-set", x: 8, y: 5 }],
    );
    const mask = equipmentMask(grid, p, 0.3)!;
    expect(mask[at(4, 2.5)]).toBe(1);
    expect(mask[at(4, 3.2)]).toBe(1); // 0.2 m outside the outline, inside the drawing margin
    expect(mask[at(4, 3.8)]).toBe(0); // the aisle: no refrigerant there
    expect(mask[at(8.6, 5.1)]).toBe(1); // 0.6 m from the line-set drop
    expect(mask[at(9.8, 0.2)]).toBe(0);
  });

  it("excludes nothing when the plan draws no equipment", () => {
    expect(equipmentMask(grid, plan([], []), 0.3)).toBeNull();
  });

  it("marks risk points in the prior and shortens distances only in fan-stirred walk-ins and machine rooms", () => {
    const p = plan(
      [
        {
          id: "w1",
          kind: "walk-in",
          polygon: [
            [0, 0],
            [3, 0],
            [3, 3],
            [0, 3],
          ],
          fans: true,
        },
        {
          id: "c1",
          kind: "open-case",
          polygon: [
            [5, 0],
            [9, 0],
            [9, 1],
            [5, 1],
          ],
          fans: true,
        },
      ],
      [{ id: "v1", kind: "valve", x: 1, y: 1 }],
    );
    const prior = riskPointPrior(grid, p, 1.5);
    expect(prior[at(1.1, 1.1)]).toBe(1.5);
    expect(prior[at(2, 2)]).toBe(0);
    const scale = fanStepScale(grid, p, 0.35)!;
    expect(scale[at(1.5, 1.5)]).toBeCloseTo(0.35, 6);
    expect(scale[at(7, 0.5)]).toBe(1);
  });

  it("says the cases run fans when at least half of them do, and ignores walk-ins", () => {
    const box = (x: number) => [
      [x, 1],
      [x + 1, 1],
      [x + 1, 2],
      [x, 2],
    ];
    const still = plan(
      [
        { id: "c1", kind: "open-case", polygon: box(1), fans: false },
        { id: "c2", kind: "island-case", polygon: box(3), fans: false },
        { id: "w1", kind: "walk-in", polygon: box(5), fans: true },
      ],
      [],
    );
    expect(casesRunFans(still.fixtures)).toBe(false);
    const stirred = plan(
      [
        { id: "c1", kind: "open-case", polygon: box(1), fans: true },
        { id: "c2", kind: "door-case", polygon: box(3), fans: false },
      ],
      [],
    );
    expect(casesRunFans(stirred.fixtures)).toBe(true);
    expect(casesRunFans(plan([], []).fixtures)).toBe(true);
  });

  it("tries the weaker drift strengths, against a higher bar, where most cases run their fans", () => {
    // fans raise the eddy diffusivity K, so the same drift speed u gives a smaller a = u/(2K)
    const settings = { driftStrengths: [0.4, 0.8], driftPenalty: 3, fansDriftStrengths: [0.4], fansDriftPenalty: 25 };
    expect(driftTrials(settings, false)).toEqual({ strengths: [0.4, 0.8], penalty: 3 });
    expect(driftTrials(settings, true)).toEqual({ strengths: [0.4], penalty: 25 });
  });
});
