import { describe, expect, it } from "vitest";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { lagStage } from "./lag-stage";
import { aisle, gridOf, rect } from "./stage-fixtures";
import { zonesStage } from "./zones-stage";

const settings = {
  zones: LOCATOR_SETTINGS.zones,
  noise: LOCATOR_SETTINGS.noise,
  nearCutoffM: LOCATOR_SETTINGS.kernel.nearCutoffM,
  elevatedPpm: LOCATOR_SETTINGS.sources.elevatedPpm,
};
const zone = { id: "aerosols", polygon: rect(10, 0, 12, 4) };

function run(ppm: number[]) {
  const input = aisle(ppm, { backgroundZones: [zone] });
  const grid = gridOf(input);
  const lag = lagStage(input.readings, input.instrument, grid, 0);
  const before = Float64Array.from(lag.ppm);
  const zones = zonesStage(input.plan.backgroundZones, 2, grid, null, lag, settings);
  expect(Array.from(lag.ppm)).toEqual(Array.from(before)); // the lag result is read, never written
  return { zones, grid };
}

describe("benign-zone stage", () => {
  it("makes a zone active when a reading at it stands out, and claims the readings at it", () => {
    const { zones, grid } = run([0, 0, 0, 0, 0, 0, 0, 0, 1, 2, 5, 6]);
    expect(zones.active).toEqual([true]);
    // readings at x 10.5 and 11.5 lie in the zone; x 8.5 and 9.5 lie within the 1.5 m margin (their cell
    // centres are 1.5 m and 0.5 m from the zone's first cell centre at 10.125 m)
    expect(Array.from(zones.zoneOfReading)).toEqual([-1, -1, -1, -1, -1, -1, -1, -1, 0, 0, 0, 0]);
    // what the zone can cause: the highest reading at it (6 ppm) over 3 alarms (6 ppm)
    expect(zones.level).toEqual([6]);
    const at = (x: number, y: number) => Math.floor(y / 0.25) * grid.width + Math.floor(x / 0.25);
    expect(zones.inside[at(11, 2)]).toBe(1);
    expect(zones.inside[at(9, 2)]).toBe(0);
    // cell centres 1.125 m and 10.125 m (the zone's first cell) along the same row: 9 m
    expect(zones.distance[at(1, 2)]).toBeCloseTo(9, 5);
    expect(zones.nearest[at(1, 2)]).toBe(0);
  });

  it("leaves a quiet zone inactive, so it explains nothing", () => {
    const { zones } = run([0, 0, 3, 8, 3, 0, 0, 0, 0, 0, 0, 0]);
    expect(zones.active).toEqual([false]);
    expect(Array.from(zones.zoneOfReading).every((z) => z === -1)).toBe(true);
    expect(zones.nearest.every((z) => z === -1)).toBe(true);
  });

  it("with no zone on the plan explains nothing and keeps no cell from a spot", () => {
    const input = aisle([0, 0, 3, 8, 3, 0, 0, 0, 0, 0, 0, 0]);
    const grid = gridOf(input);
    const lag = lagStage(input.readings, input.instrument, grid, 0);
    const zones = zonesStage([], 2, grid, null, lag, settings);
    expect(zones.columns).toEqual([]);
    expect(zones.active).toEqual([]);
    expect(Array.from(zones.zoneOfReading)).toEqual(new Array(12).fill(-1));
    expect(zones.inside.every((v) => v === 0)).toBe(true);
    expect(zones.distance.every((d) => d === Infinity)).toBe(true);
    expect(zones.nearest.every((z) => z === -1)).toBe(true);
    // a zone's gas is fitted out to twice its screening length (12 m) plus the 1.5 m margin
    expect(zones.reachM).toBe(25.5);
  });
});
