import { describe, expect, it } from "vitest";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { cellCentre } from "../grid/plan-grid";
import { fieldStage } from "./field-stage";
import { lagStage } from "./lag-stage";
import { aisle, gridOf, plume, rect } from "./stage-fixtures";
import { sourcesStage, supportingReadings } from "./sources-stage";
import { zonesStage } from "./zones-stage";

const S = LOCATOR_SETTINGS;

function run(ppm: number[], fans = false) {
  // a case along the north wall, open to the aisle; its fans decide the kernel and the drift
  const input = aisle(ppm, { fixtures: [{ id: "case-1", kind: "open-case", polygon: rect(0, 0, 12, 1), fans }] });
  const grid = gridOf(input);
  const lag = lagStage(input.readings, input.instrument, grid, 0);
  const zones = zonesStage([], 2, grid, null, lag, {
    zones: S.zones,
    noise: S.noise,
    nearCutoffM: S.kernel.nearCutoffM,
    elevatedPpm: S.sources.elevatedPpm,
  });
  const field = fieldStage(grid, null, fans, lag, zones, S);
  const sumBefore = Float64Array.from(field.fields.sumWG);
  const sources = sourcesStage(input.plan, grid, lag, zones, field, {
    kernel: S.kernel,
    sources: S.sources,
    zoneMarginM: S.zones.marginM,
  });
  // the field stage's result is read, never rewritten (the drift makes new fields)
  expect(Array.from(field.fields.sumWG)).toEqual(Array.from(sumBefore));
  return { grid, sources };
}

describe("sources stage", () => {
  it("finds one leak on the case beside the peak of a plume", () => {
    for (const fans of [false, true]) {
      const { grid, sources } = run(plume(6.5, 20), fans);
      const fitted = sources.found.filter((s) => !s.alternate);
      expect(fitted.length).toBeGreaterThanOrEqual(1);
      const [x, y] = cellCentre(grid, fitted[0].cell);
      expect(Math.abs(x - 6.5)).toBeLessThan(1.5);
      expect(y).toBeLessThan(1.3); // on the case (0-1 m) or its 0.3 m margin
    }
  });

  it("finds nothing in level readings", () => {
    expect(run(new Array(12).fill(1)).sources.found).toEqual([]);
  });

  it("allows spots only on equipment near the readings", () => {
    const { grid, sources } = run(new Array(12).fill(1));
    const at = (x: number, y: number) => Math.floor(y / 0.25) * grid.width + Math.floor(x / 0.25);
    expect(sources.allowed[at(6, 0.5)]).toBe(1);
    expect(sources.allowed[at(6, 3)]).toBe(0); // open floor
  });
});

describe("supporting readings", () => {
  it("counts readings near the spot, outside active zones, elevated over the background", () => {
    const rule = { threshold: 0.2, elevatedPpm: 1.5, zoneOfReading: Int32Array.from([-1, -1, 0, -1]) };
    const column = Float64Array.from([0.5, 0.1, 0.9, 0.3]);
    const residual = Float64Array.from([4, 9, 9, 2]);
    // reading 1 is too far, reading 2 is the zone's, reading 3 is only 1 ppm over b = 1
    expect(supportingReadings(rule, column, 1, residual)).toEqual([0]);
  });
});
