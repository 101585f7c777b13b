import type { LocatorInput } from "../../contracts/locator-input";
import type { SourceSettings } from "./settings";
import { GeodesicSearch } from "../grid/geodesic-distance";
import { cellsInside, nearestFreeCell, type PlanGrid } from "../grid/plan-grid";

// Per-cell layers the locator derives from the drawn plan.

// The layers depend only on the grid and the plan, which stay the same while one analysis runs the
// pipeline again with another delay: each is drawn once per grid and plan and then shared (read only).
type Memo<T> = WeakMap<PlanGrid, { plan: LocatorInput["plan"]; value: number; layer: T }>;
const equipmentMemo: Memo<Uint8Array | null> = new WeakMap();
const priorMemo: Memo<Float64Array> = new WeakMap();
const roomsMemo: Memo<Float32Array | null> = new WeakMap();

function remembered<T>(memo: Memo<T>, grid: PlanGrid, plan: LocatorInput["plan"], value: number, draw: () => T): T {
  const hit = memo.get(grid);
  if (hit && hit.plan === plan && hit.value === value) return hit.layer;
  const layer = draw();
  memo.set(grid, { plan, value, layer });
  return layer;
}

/**
 * Cells where refrigerant can escape: inside a fixture (cases, walk-ins, machine rooms hold the coils,
 * valves and piping) or near a drawn risk point, each grown by `margin` for drawing error. Null when
 * the plan draws no equipment at all, so nothing is excluded.
 */
export function equipmentMask(grid: PlanGrid, plan: LocatorInput["plan"], margin: number): Uint8Array | null {
  return remembered(equipmentMemo, grid, plan, margin, () => drawEquipmentMask(grid, plan, margin));
}

function drawEquipmentMask(grid: PlanGrid, plan: LocatorInput["plan"], margin: number): Uint8Array | null {
  if (plan.fixtures.length === 0 && plan.riskPoints.length === 0) return null;
  const mask = new Uint8Array(grid.width * grid.height);
  const search = new GeodesicSearch(grid);
  const seeds: number[] = [];
  for (const f of plan.fixtures) for (const k of cellsInside(grid, f.polygon)) seeds.push(k);
  for (const p of plan.riskPoints) {
    const k = nearestFreeCell(grid, p.x, p.y);
    if (k >= 0) seeds.push(k);
  }
  const settled = search.reachFromCells(seeds, margin);
  for (let q = 0; q < settled; q++) mask[search.settled[q]] = 1;
  for (const p of plan.riskPoints) {
    const settledRp = search.fromPoint(p.x, p.y, 1);
    for (let q = 0; q < settledRp; q++) mask[search.settled[q]] = 1;
  }
  return mask;
}

/** Step scale per cell: `scale` inside walk-ins and machine rooms whose fans run, 1 elsewhere; null when none. */
export function fanStepScale(grid: PlanGrid, plan: LocatorInput["plan"], scale: number): Float32Array | null {
  // Only closed rooms: a walk-in's or machine room's fans stir the whole room, while a case's fans drive
  // an air curtain along the case, so gas still travels along it.
  const withFans = plan.fixtures.filter((f) => f.fans && (f.kind === "walk-in" || f.kind === "machine-room"));
  if (withFans.length === 0) return null;
  const out = new Float32Array(grid.width * grid.height).fill(1);
  for (const f of withFans) for (const k of cellsInside(grid, f.polygon)) out[k] = scale;
  return out;
}

/** `fanStepScale` drawn once per grid and plan (read only): the sources stage asks for it in every run. */
export function fanRoomsScale(grid: PlanGrid, plan: LocatorInput["plan"], scale: number): Float32Array | null {
  return remembered(roomsMemo, grid, plan, scale, () => fanStepScale(grid, plan, scale));
}

/** Log prior odds per cell: `logOdds` within 0.5 m of a line-set drop, valve or coil, where joints leak most. */
export function riskPointPrior(grid: PlanGrid, plan: LocatorInput["plan"], logOdds: number): Float64Array {
  return remembered(priorMemo, grid, plan, logOdds, () => drawRiskPointPrior(grid, plan, logOdds));
}

function drawRiskPointPrior(grid: PlanGrid, plan: LocatorInput["plan"], logOdds: number): Float64Array {
  const prior = new Float64Array(grid.width * grid.height);
  const search = new GeodesicSearch(grid);
  for (const p of plan.riskPoints) {
    const settled = search.fromPoint(p.x, p.y, 0.5);
    for (let q = 0; q < settled; q++) prior[search.settled[q]] = logOdds;
  }
  return prior;
}

/**
 * Whether most of the plan's cases run their fans (true when it draws no cases). Fans stir gas out to
 * several metres in eddies of every size, the far-field part of the source kernel; in still air the
 * drift alone carries it (local-drift.ts).
 */
export function casesRunFans(fixtures: LocatorInput["plan"]["fixtures"]): boolean {
  const cases = fixtures.filter((f) => f.kind === "open-case" || f.kind === "island-case" || f.kind === "door-case");
  return cases.length === 0 || cases.filter((f) => f.fans).length * 2 >= cases.length;
}

/**
 * The drift strengths a = u/(2K) tried per candidate cell (local-drift.ts). Where most cases run their
 * fans, their stirring raises the eddy diffusivity (0.1–0.3 m²/s against 0.01–0.05 in aisles,
 * docs/locator/design-ranges.md), so the same 0.02–0.1 m/s drift gives a smaller a: only the weaker
 * strengths are tried there, with a higher bar. Stronger ones let a spot several metres upwind explain a
 * whole lineup's plume (decision 0062).
 */
export function driftTrials(
  settings: Pick<SourceSettings, "driftStrengths" | "driftPenalty" | "fansDriftStrengths" | "fansDriftPenalty">,
  fansStir: boolean,
): { strengths: readonly number[]; penalty: number } {
  return fansStir
    ? { strengths: settings.fansDriftStrengths, penalty: settings.fansDriftPenalty }
    : { strengths: settings.driftStrengths, penalty: settings.driftPenalty };
}
