import type { LocatorBackgroundZone } from "../../contracts/locator-input";
import { polygonCentroid } from "../geometry/polygon-area";
import { borrowSearch, giveBackSearch } from "../grid/geodesic-distance";
import { cellsInside, nearestFreeCell, type PlanGrid } from "../grid/plan-grid";
import { fitNonnegative } from "../locator/nonnegative-fit";
import type { NoiseSettings, ZoneSettings } from "../locator/settings";
import { createSourceKernel } from "../locator/source-kernel";
import type { LagResult } from "./lag-stage";
import { medianOf, readingWeights } from "./numbers";

/** Stage 2: benign-source zones, fixed nuisance sources whose distance is measured from the whole zone. */
export interface ZonesResult {
  /** Per zone, its kernel value at every reading (a fixed column of the fit). */
  readonly columns: readonly Float64Array[];
  /** Per zone, its strength in the zone-only fit. */
  readonly zoneOnlyQ: readonly number[];
  /** A zone is active when the zone-only fit gives it gas and a reading at the zone stands out. */
  readonly active: readonly boolean[];
  /** Per cell, the distance to the nearest active zone (Infinity beyond its reach) and that zone (-1). */
  readonly distance: Float32Array;
  readonly nearest: Int32Array;
  /** 1 inside any listed zone, active or not: no suspect spot is ever placed there. */
  readonly inside: Uint8Array;
  /** Per reading, the active zone it lies at (within the margin), or -1. */
  readonly zoneOfReading: Int32Array;
  /** What each zone can make readings show, ppm. */
  readonly level: readonly number[];
  /** How far a zone's gas is fitted, m. */
  readonly reachM: number;
}

export function zonesStage(
  zones: readonly LocatorBackgroundZone[],
  alarmPpm: number,
  grid: PlanGrid,
  stepScale: Float32Array | null,
  lag: LagResult,
  settings: { zones: ZoneSettings; noise: NoiseSettings; nearCutoffM: number; elevatedPpm: number },
): ZonesResult {
  const { ppm: y, cell: readingCell } = lag;
  const n = y.length;
  const cells = grid.width * grid.height;
  const z0 = settings.zones;
  // No zone on the plan (most plans): nothing to search or fit, on every delay an analysis tries
  // (docs/decisions/0160). The same result as the general path below gives with no zone.
  if (zones.length === 0) return noZones(n, cells, 2 * z0.screeningLengthM + z0.marginM);
  // a zone is a spread-out source whose gas drifts far, so it gets a longer kernel
  const kernel = createSourceKernel(z0.screeningLengthM, settings.nearCutoffM, 2 * z0.screeningLengthM + z0.marginM);
  const search = borrowSearch(grid, stepScale);
  const cellDist: Float32Array[] = [];
  const readingDist: Float64Array[] = [];
  const columns = zones.map((zone) => {
    let zc = cellsInside(grid, zone.polygon).filter((k) => !grid.blocked[k]);
    if (zc.length === 0) {
      const [cx, cy] = polygonCentroid(zone.polygon);
      zc = [nearestFreeCell(grid, cx, cy)].filter((k) => k >= 0);
    }
    const settled = search.reachFromCells(zc, kernel.truncationM);
    const dist = new Float32Array(cells).fill(Infinity);
    for (let q = 0; q < settled; q++) dist[search.settled[q]] = search.dist[search.settled[q]];
    cellDist.push(dist);
    const rd = Float64Array.from(readingCell, (k) => dist[k]);
    readingDist.push(rd);
    return Float64Array.from(rd, (d) => kernel.at(d));
  });
  giveBackSearch(search);
  // Only an active zone explains the readings around it and keeps suspect spots off its surroundings.
  // Gas spreading from a zone is strongest at it, so a zone that reads nothing where it is cannot be
  // what raised readings elsewhere.
  const zoneFit = fitNonnegative(y, readingWeights(y, settings.noise), columns, lag.censored);
  const typical = medianOf(y);
  const active = zones.map(
    (_, z) =>
      zoneFit.q[z] > 0.5 && readingDist[z].some((d, i) => d <= z0.marginM && y[i] >= typical + settings.elevatedPpm),
  );
  const distance = new Float32Array(cells).fill(Infinity);
  const nearest = new Int32Array(cells).fill(-1);
  const inside = new Uint8Array(cells);
  cellDist.forEach((dist, z) => {
    for (let c = 0; c < cells; c++) {
      if (dist[c] === 0) inside[c] = 1;
      if (active[z] && dist[c] < distance[c]) {
        distance[c] = dist[c];
        nearest[c] = z;
      }
    }
  });
  const zoneOfReading = new Int32Array(n).fill(-1);
  readingDist.forEach((rd, z) => {
    if (!active[z]) return;
    for (let i = 0; i < n; i++) if (rd[i] <= z0.marginM && zoneOfReading[i] < 0) zoneOfReading[i] = z;
  });
  // its stated typical reading, the readings at it, or by default `typicalAlarms` times the alarm level
  const level = zones.map((zone, z) => {
    let v = zone.ppm ?? z0.typicalAlarms * alarmPpm;
    for (let i = 0; i < n; i++) if (zoneOfReading[i] === z) v = Math.max(v, y[i]);
    return v;
  });
  return {
    columns,
    zoneOnlyQ: zoneFit.q,
    active,
    distance,
    nearest,
    inside,
    zoneOfReading,
    level,
    reachM: kernel.truncationM,
  };
}

function noZones(readings: number, cells: number, reachM: number): ZonesResult {
  return {
    columns: [],
    zoneOnlyQ: [],
    active: [],
    distance: new Float32Array(cells).fill(Infinity),
    nearest: new Int32Array(cells).fill(-1),
    inside: new Uint8Array(cells),
    zoneOfReading: new Int32Array(readings).fill(-1),
    level: [],
    reachM,
  };
}
