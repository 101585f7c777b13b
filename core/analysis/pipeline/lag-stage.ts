import type { LocatorInstrument, LocatorReading } from "../../contracts/locator-input";
import { nearestFreeCell, type PlanGrid } from "../grid/plan-grid";
import { gridRoute } from "../lag/grid-route";
import type { LaggedPosition } from "../lag/lag-correct";
import { walkLag } from "../lag/walk-lag";

/** Stage 1: where each reading's air was drawn in, and the readings as arrays for the later stages. */
export interface LagResult {
  readonly positions: readonly LaggedPosition[];
  /** Lag-corrected position of each reading, m. */
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  readonly ppm: Float64Array;
  /** 1 for an over-range ("at least") reading. */
  readonly censored: Uint8Array;
  /** The free grid cell nearest each corrected position. */
  readonly cell: Int32Array;
}

/**
 * Moves each reading back along the walked route (around solid bodies) by the transport delay plus the
 * time constant: the same walkLag the Walk screen's lag hint calls, so both mark the same point.
 */
export function lagStage(
  readings: readonly LocatorReading[],
  instrument: Pick<LocatorInstrument, "transportDelayS" | "timeConstantS">,
  grid: PlanGrid,
  walkSpeedMps: number,
): LagResult {
  const positions = walkLag(
    readings,
    instrument.transportDelayS,
    instrument.timeConstantS,
    gridRoute(grid),
    walkSpeedMps,
  );
  const n = readings.length;
  const xs = Float64Array.from(positions, (p) => p.x);
  const ys = Float64Array.from(positions, (p) => p.y);
  const cell = new Int32Array(n);
  for (let i = 0; i < n; i++) cell[i] = nearestFreeCell(grid, xs[i], ys[i]);
  return {
    positions,
    xs,
    ys,
    ppm: Float64Array.from(readings, (r) => r.ppm),
    censored: Uint8Array.from(readings, (r) => (r.atLeast ? 1 : 0)),
    cell,
  };
}
