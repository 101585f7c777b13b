import { describe, expect, it } from "vitest";
import { cellCentre } from "../grid/plan-grid";
import { fieldStage } from "../pipeline/field-stage";
import { lagStage } from "../pipeline/lag-stage";
import { aisle, gridOf, plume, rect } from "../pipeline/stage-fixtures";
import { zonesStage } from "../pipeline/zones-stage";
import { orderFitted, relocateSources, type FoundSource } from "./greedy-sources";
import { fitNonnegative } from "./nonnegative-fit";
import { kernelColumn } from "./reading-fields";
import { LOCATOR_SETTINGS as S } from "./settings";

// A case along the north wall of the 12 m aisle, a plume peaking at x = 6.5 (stage-fixtures.ts).
function setUp(ppm: number[]) {
  const input = aisle(ppm, { fixtures: [{ id: "case-1", kind: "open-case", polygon: rect(0, 0, 12, 1), fans: true }] });
  const grid = gridOf(input);
  const lag = lagStage(input.readings, input.instrument, grid, 0);
  const zones = zonesStage([], 2, grid, null, lag, {
    zones: S.zones,
    noise: S.noise,
    nearCutoffM: S.kernel.nearCutoffM,
    elevatedPpm: S.sources.elevatedPpm,
  });
  const field = fieldStage(grid, null, true, lag, zones, S);
  const cellAt = (x: number, y: number) => Math.floor(y / 0.25) * grid.width + Math.floor(x / 0.25);
  const allowed = new Uint8Array(grid.width * grid.height);
  for (let c = 0; c < allowed.length; c++) allowed[c] = cellCentre(grid, c)[1] < 1 ? 1 : 0; // on the case
  const base = {
    fields: field.fields,
    y: lag.ppm,
    w: field.weights,
    censored: lag.censored,
    nuisance: [],
    allowed,
    gridWidth: grid.width,
    cellSize: grid.cellSize,
    sourceSeparationM: 4,
    prior: null,
  };
  const sourceAt = (x: number) => {
    const cell = cellAt(x, 0.5);
    const column = kernelColumn(field.fields, cell, lag.ppm.length);
    return { cell, delta: 0, column, alternate: false, q: 0, surface: new Float64Array(0) };
  };
  const fitOf = (columns: Float64Array[]) => fitNonnegative(lag.ppm, field.weights, columns, lag.censored);
  return { grid, base, sourceAt, fitOf };
}

describe("relocateSources", () => {
  it("moves a source placed beside a plume onto its peak", () => {
    const { grid, base, sourceAt, fitOf } = setUp(plume(6.5, 20));
    const off = sourceAt(3.5);
    const { sources, fit } = relocateSources(base, [off], fitOf([off.column]));
    const [x] = cellCentre(grid, sources[0].cell);
    expect(Math.abs(x - 6.5)).toBeLessThan(1);
    // the joint fit is redone with the moved source and explains the readings better
    expect(fit.chi2).toBeLessThan(fitOf([off.column]).chi2);
  });

  it("never moves a source farther than the source separation, nor onto another source", () => {
    const ppm = plume(2.5, 20).map((v, i) => v + plume(9.5, 20)[i]);
    const { grid, base, sourceAt, fitOf } = setUp(ppm);
    const a = sourceAt(2.5);
    const b = sourceAt(9.5);
    const { sources } = relocateSources(base, [a, b], fitOf([a.column, b.column]));
    const xs = sources.map((s) => cellCentre(grid, s.cell)[0]);
    expect(Math.abs(xs[0] - 2.5)).toBeLessThanOrEqual(4);
    expect(Math.abs(xs[1] - 9.5)).toBeLessThanOrEqual(4);
    expect(Math.abs(xs[1] - xs[0])).toBeGreaterThanOrEqual(4);
  });
});

describe("orderFitted", () => {
  // four readings; each source's kernel value at each of them
  const source = (name: string, q: number, column: number[]): FoundSource & { name: string } => ({
    name,
    cell: 0,
    delta: 0,
    column: Float64Array.from(column),
    alternate: false,
    q,
    surface: new Float64Array(0),
  });
  const names = (list: FoundSource[]) => list.map((s) => (s as FoundSource & { name: string }).name);

  it("lists first the strongest source of the ranked rounds, then each by the highest reading share it explains", () => {
    const leak = source("leak", 1, [1, 0.5, 0, 0]); // explains 1 ppm of reading 0
    const mopUp = source("mop-up", 0.9, [0, 0.2, 0.2, 0.2]); // a little of three readings: 0.18 at most
    const second = source("second", 0.5, [0, 0, 0, 1]); // its own peak: 0.5
    expect(names(orderFitted([leak, mopUp, second], 3))).toEqual(["leak", "second", "mop-up"]);
  });

  it("never lists a source of a later round first, however strong", () => {
    const a = source("a", 1, [1, 0, 0, 0]);
    const b = source("b", 0.8, [0, 1, 0, 0]);
    const late = source("late", 3, [0, 0, 1, 0]);
    expect(names(orderFitted([a, b, late], 2))).toEqual(["a", "late", "b"]);
    expect(orderFitted([], 3)).toEqual([]);
  });
});
