import { gridCellCount, LocatorInputError, MAX_GRID_CELLS, type LocatorInput } from "../contracts/locator-input";
import type { Candidate, CorrectedReading, Diagnostic, LocatorResult, ReadingFlag } from "../contracts/locator-output";
import { polygonCentroid } from "./geometry/polygon-area";
import { GeodesicSearch } from "./grid/geodesic-distance";
import { cellCentre, cellIndexOf, cellsInside, createPlanGrid, nearestFreeCell } from "./grid/plan-grid";
import { gridRoute } from "./lag/grid-route";
import { responseNodes } from "./lag/response-nodes";
import { walkLag } from "./lag/walk-lag";
import { estimateBackground } from "./locator/background";
import { candidateNextCheck, candidateReason, type CandidateFacts } from "./locator/candidate-words";
import { benignSource, fansMixing, oneSidedPass, sparseCoverage } from "./locator/diagnostics";
import { fieldMap } from "./locator/field-map";
import { refineCell } from "./locator/local-refine";
import { findSources, type FoundSource } from "./locator/greedy-sources";
import { fitNonnegative } from "./locator/nonnegative-fit";
import { DEFAULT_LOCATOR_OPTIONS, type LocatorOptions } from "./locator/locator-options";
import { nearestFixture, nearestRiskPoint } from "./locator/nearest-features";
import { casesRunFans, equipmentMask, fanStepScale, fitsDrift, riskPointPrior } from "./locator/plan-masks";
import { chooseLocalDrift } from "./locator/local-drift";
import { accumulateReadingFields, kernelColumn } from "./locator/reading-fields";
import { createSourceKernel, kernelArea } from "./locator/source-kernel";
import { HOURS_PER_YEAR, MOLAR_VOLUME_25C_L, ppmToMgPerM3, wellMixedEmission } from "./locator/units";

export type { LocatorOptions } from "./locator/locator-options";

/**
 * The locator (docs/locator/method.md): lag-corrected readings, a confidence-weighted concentration field and ranked
 * suspect spots with diagnostics. Pure: no I/O, deterministic for the same input and options.
 * The input must already satisfy locatorInputSchema (parseLocatorInput).
 */
export function locate(input: LocatorInput, options: Partial<LocatorOptions> = {}): LocatorResult {
  const o: LocatorOptions = { ...DEFAULT_LOCATOR_OPTIONS, ...options };
  const { plan, instrument, readings } = input;
  if (!(o.cellSize > 0))
    throw new LocatorInputError([`options.cellSize: must be a positive number of metres, got ${o.cellSize}`]);
  const cellsNeeded = gridCellCount(plan.width, plan.height, o.cellSize);
  if (cellsNeeded > MAX_GRID_CELLS) {
    throw new LocatorInputError([
      `plan: a ${plan.width} m x ${plan.height} m plan needs ${cellsNeeded} cells at ${o.cellSize} m, over the memory budget of ${MAX_GRID_CELLS}`,
    ]);
  }
  if (readings.length === 0) throw new LocatorInputError(["readings: must not be empty"]);

  const grid = createPlanGrid(
    plan.width,
    plan.height,
    o.cellSize,
    plan.obstacles.map((b) => b.polygon),
  );
  // the far-field part of the kernel is the fans' stirring; in still air the drift carries the gas
  const far =
    o.farShare > 0 && (!o.farWithFansOnly || casesRunFans(plan.fixtures))
      ? { lengthM: o.farScreeningLengthM, share: o.farShare }
      : null;
  const kernel = createSourceKernel(o.screeningLengthM, o.nearCutoffM, o.truncationM, far);
  // a benign-source zone is a spread-out source whose gas drifts far, so it gets a longer kernel
  const zoneKernel = createSourceKernel(
    o.zoneScreeningLengthM,
    o.nearCutoffM,
    2 * o.zoneScreeningLengthM + o.zoneMarginM,
  );
  const n = readings.length;

  // 1. lag correction along the walked route
  // (the same walkLag the Walk screen's lag hint calls, over the same grid route)
  const lagged = walkLag(
    readings,
    instrument.transportDelayS,
    instrument.timeConstantS,
    gridRoute(grid),
    o.walkSpeedMps,
  );
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const y = new Float64Array(n);
  const censored = new Uint8Array(n);
  const readingCell = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    xs[i] = lagged[i].x;
    ys[i] = lagged[i].y;
    y[i] = readings[i].ppm;
    censored[i] = readings[i].atLeast ? 1 : 0;
    readingCell[i] = nearestFreeCell(grid, xs[i], ys[i]);
  }

  // 2. benign-source zones: fixed nuisance sources, distance measured from the whole zone
  const cells = grid.width * grid.height;
  const stepScale = o.fanMixingScale < 1 ? fanStepScale(grid, plan, o.fanMixingScale) : null;
  const zoneSearch = new GeodesicSearch(grid, stepScale);
  const zoneCellDist: Float32Array[] = [];
  const zoneReadingDist: Float64Array[] = [];
  const nuisance = plan.backgroundZones.map((zone) => {
    let zc = cellsInside(grid, zone.polygon).filter((k) => !grid.blocked[k]);
    if (zc.length === 0) {
      const [cx, cy] = polygonCentroid(zone.polygon);
      zc = [nearestFreeCell(grid, cx, cy)].filter((k) => k >= 0);
    }
    const settled = zoneSearch.fromCells(zc, zoneKernel.truncationM);
    const dist = new Float32Array(cells).fill(Infinity);
    for (let q = 0; q < settled; q++) dist[zoneSearch.settled[q]] = zoneSearch.dist[zoneSearch.settled[q]];
    zoneCellDist.push(dist);
    const rd = Float64Array.from(readingCell, (k) => dist[k]);
    zoneReadingDist.push(rd);
    return Float64Array.from(rd, (d) => zoneKernel.at(d));
  });
  // A zone is active when the zone-only fit gives it gas. Only an active zone explains the readings
  // around it and keeps suspect spots off its surroundings; nothing is ever placed inside a zone.
  const zoneFit = fitNonnegative(y, weightsFor(y, o), nuisance, censored);
  // ... and, when `zoneSeenAtZone` is set, when a reading at the zone itself stands out: gas spreading from a
  // zone is strongest at it, so a zone that reads nothing where it is cannot be what raised readings elsewhere.
  const typical = medianOf(y);
  const zoneActive = plan.backgroundZones.map(
    (_, z) =>
      zoneFit.q[z] > 0.5 &&
      (!o.zoneSeenAtZone || zoneReadingDist[z].some((d, i) => d <= o.zoneMarginM && y[i] >= typical + o.elevatedPpm)),
  );
  const zoneDist = new Float32Array(cells).fill(Infinity); // to the nearest active zone
  const zoneNearest = new Int32Array(cells).fill(-1);
  const insideZone = new Uint8Array(cells);
  zoneCellDist.forEach((dist, z) => {
    for (let c = 0; c < cells; c++) {
      if (dist[c] === 0) insideZone[c] = 1;
      if (zoneActive[z] && dist[c] < zoneDist[c]) {
        zoneDist[c] = dist[c];
        zoneNearest[c] = z;
      }
    }
  });
  const zoneOfReading = new Int32Array(n).fill(-1);
  zoneReadingDist.forEach((rd, z) => {
    if (!zoneActive[z]) return;
    for (let i = 0; i < n; i++) if (rd[i] <= o.zoneMarginM && zoneOfReading[i] < 0) zoneOfReading[i] = z;
  });
  // What an active zone can make readings show: its stated typical reading, the readings at it, or by
  // default `zoneTypicalAlarms` times the alarm level.
  const zoneLevel = plan.backgroundZones.map((zone, z) => {
    let level = zone.ppm ?? o.zoneTypicalAlarms * instrument.alarmPpm;
    for (let i = 0; i < n; i++) if (zoneOfReading[i] === z) level = Math.max(level, y[i]);
    return level;
  });

  // 3. background and weights (noise is multiplicative plus a floor: w = 1/(a + β·y)²)
  const usable = new Uint8Array(n);
  for (let i = 0; i < n; i++) usable[i] = !censored[i] && zoneOfReading[i] < 0 ? 1 : 0;
  const background = estimateBackground(y, usable);
  const w = weightsFor(y, o);

  // 4. one truncated geodesic search per sampled cell feeds both the field map and the source scan
  // the fit predicts each reading through the sensor's response along the walk (forward model)
  // (one node is the plain D + τ shift already computed: routing the walk again costs more than the fit)
  const nodes =
    o.responseNodes <= 1 || !(instrument.timeConstantS > 0)
      ? { xs: [xs], ys: [ys], weights: [1] }
      : responseNodes(readings, instrument.transportDelayS, instrument.timeConstantS, o.responseNodes, {
          route: gridRoute(grid),
          walkSpeedMps: o.walkSpeedMps > 0 ? o.walkSpeedMps : undefined,
        });
  const fields = accumulateReadingFields(grid, nodes, y, w, kernel, o.mapSigmaM, stepScale);
  const field = fieldMap(fields, grid.width, grid.height, grid.cellSize);

  // 5. suspect spots
  const onEquipment = o.sourcesOnEquipment ? equipmentMask(grid, plan, o.equipmentMarginM) : null;
  const allowed = new Uint8Array(cells);
  for (let c = 0; c < cells; c++) {
    allowed[c] =
      !grid.blocked[c] &&
      !insideZone[c] &&
      zoneDist[c] > o.zoneMarginM &&
      fields.nearestReading[c] <= o.maxReachM &&
      (!onEquipment || onEquipment[c])
        ? 1
        : 0;
  }
  const supportThreshold = kernel.at(o.supportRadiusM);
  const support = (column: Float64Array, b: number, residual: Float64Array) => {
    const idx: number[] = [];
    for (let i = 0; i < n; i++) {
      if (column[i] >= supportThreshold && zoneOfReading[i] < 0 && residual[i] - b >= o.elevatedPpm) idx.push(i);
    }
    return idx;
  };
  if (fitsDrift(o.driftStrengths, plan.fixtures) && fields.dist) {
    // in still air each candidate source takes the weak drift that fits its readings best (local-drift.ts)
    const residual0 = new Float64Array(y);
    nuisance.forEach((col, z) => {
      if (zoneFit.q[z] > 0) for (let i = 0; i < n; i++) residual0[i] -= zoneFit.q[z] * col[i];
    });
    chooseLocalDrift(fields, grid.width, grid.cellSize, w, residual0, allowed, {
      screeningLengthM: o.screeningLengthM,
      far,
      nearCutoffM: o.nearCutoffM,
      truncationM: o.truncationM,
      strengths: o.driftStrengths,
      penalty: o.driftPenalty,
    });
  }
  const prior = o.riskPointLogOdds > 0 ? riskPointPrior(grid, plan, o.riskPointLogOdds) : null;
  const greedy = findSources({
    fields,
    y,
    w,
    censored,
    nuisance,
    allowed,
    gridWidth: grid.width,
    cellSize: grid.cellSize,
    maxLeaks: o.maxLeaks,
    maxCandidates: o.maxCandidates,
    separationM: o.separationM,
    alternateFraction: o.alternateFraction,
    rankByStrength: o.rankByStrength,
    sourceSeparationM: o.sourceSeparationM,
    prior,
    evidenceGate: o.evidenceGate,
    relocatePasses: o.relocatePasses,
    tailReachM: o.tailReachM,
    credible: (c, column, _q, b, residual, delta) => {
      if (delta < o.minDeltaChi2) return false;
      const sup = support(column, b, residual);
      if (sup.length < o.minSupport) return false;
      // Within reach of a benign-source zone, a spot must read more than the zone does: gas spreading
      // from the zone thins out with distance, so weaker readings there are most simply the zone's.
      const z = zoneNearest[c];
      if (z >= 0 && zoneDist[c] <= zoneKernel.truncationM) return sup.some((i) => y[i] > zoneLevel[z]);
      return true;
    },
  });
  const dof = Math.max(1, n - 2 - greedy.sources.length - nuisance.length);
  const s2 = Math.max(1, greedy.chi2Final / dof);
  // In a walk-in or machine room whose fans run the readings are level all over the room, so where in
  // the room the leak is cannot be read from them: take the room's most probable cell (tempered fit plus
  // the risk-point prior), which is a coil, valve or line-set drop unless the readings say otherwise.
  const roomOf = new Int32Array(cells).fill(-1);
  if (o.mixedRoomMode) {
    plan.fixtures.forEach((f, r) => {
      if (f.fans && (f.kind === "walk-in" || f.kind === "machine-room"))
        for (const k of cellsInside(grid, f.polygon)) roomOf[k] = r;
    });
  }
  const taken: number[] = [];
  const farFromTaken = (k: number, minM: number) =>
    taken.every((t) => cellDistance(t, k, grid.width) * grid.cellSize >= minM);
  const roomBest = (s: FoundSource, room: number, riskOnly = false): number => {
    const surface = o.ownSurface ? s.surface : greedy.firstScan.delta;
    const T = o.refineInflation * s2;
    let best = -1;
    let bestScore = -Infinity;
    for (const k of cellsInside(grid, plan.fixtures[room].polygon)) {
      if (
        !allowed[k] ||
        !(surface[k] > 0) ||
        !farFromTaken(k, riskOnly ? ROOM_RISK_SPACING_M : o.separationM) ||
        (riskOnly && !(prior && prior[k] > 0))
      )
        continue;
      const score = surface[k] / (2 * T) + (prior ? prior[k] : 0);
      if (score > bestScore) {
        bestScore = score;
        best = k;
      }
    }
    return best;
  };
  const sources: FoundSource[] = [];
  for (const s of addMirrorSpot(greedy.sources)) {
    const room = roomOf[s.cell];
    if (room < 0) {
      const cell = refineCell(
        o.ownSurface ? s.surface : greedy.firstScan.delta,
        allowed,
        s.cell,
        grid.width,
        grid.cellSize,
        o.refineRadiusM,
        o.refineInflation * s2,
        o.refinePrior ? prior : null,
      );
      sources.push(cell === s.cell ? s : { ...s, cell, column: kernelColumn(fields, cell, n) });
      taken.push(cell);
      continue;
    }
    const best = roomBest(s, room);
    if (best < 0) continue; // every cell of the room is already listed
    sources.push(best === s.cell ? s : { ...s, cell: best, column: kernelColumn(fields, best, n) });
    taken.push(best);
    if (s.alternate) continue;
    // the room's next most probable risk point (else cell) follows a fitted spot placed in a fan-stirred room
    let next = roomBest(s, room, true);
    if (next < 0) next = roomBest(s, room);
    if (next >= 0) {
      const surface = o.ownSurface ? s.surface : greedy.firstScan.delta;
      sources.push({
        cell: next,
        delta: surface[next],
        column: kernelColumn(fields, next, n),
        alternate: true,
        q: s.q,
        surface,
      });
      taken.push(next);
    }
  }
  sources.splice(o.maxCandidates);
  const topQ = Math.max(sources[0]?.q ?? 0, 1e-12);
  const gPerYearPerQ =
    (wellMixedEmission(ppmToMgPerM3(1, o.molarMassGPerMol), o.airChangesPerH, kernelArea(kernel) * o.mixingHeightM) *
      HOURS_PER_YEAR) /
    1000;
  const candidates: Candidate[] = [];
  let oneSidedTop = false;
  sources.forEach((s, rank) => {
    const [x, y0] = cellCentre(grid, s.cell);
    const sup = support(s.column, greedy.fit.b, y);
    const side = oneSidedPass(
      sup.map((i) => xs[i]),
      sup.map((i) => ys[i]),
      x,
      y0,
    );
    if (rank === 0) oneSidedTop = side.oneSided;
    const radius = Math.max(
      o.minRadiusM,
      o.radiusScale *
        misfitRadius(o.ownSurface ? s.surface : greedy.firstScan.delta, s.cell, 5.99 * s2, grid.width, grid.cellSize),
    );
    const fixture = nearestFixture(plan.fixtures, x, y0);
    const riskPoint = nearestRiskPoint(plan.riskPoints, x, y0);
    const facts: CandidateFacts = {
      alternate: s.alternate,
      supportCount: sup.length,
      peakPpm: sup.reduce((m, i) => Math.max(m, y[i]), 0),
      backgroundPpm: background.ppm,
      fixture,
      riskPoint,
      oneSided: side.oneSided,
      radius,
    };
    const rawScore = 1 - Math.exp(-0.5 * Math.sqrt(s.delta / (s2 * o.minDeltaChi2)));
    const score = Math.min(rawScore, rank > 0 ? candidates[rank - 1].score : 1);
    candidates.push({
      rank: rank + 1,
      x: round2(x),
      y: round2(y0),
      radius: round2(radius),
      score: round2(score),
      strength: round2(s.q / topQ),
      strengthGPerYear: Math.round(s.q * gPerYearPerQ),
      fixtureId: fixture?.item.id ?? null,
      riskPointId: riskPoint?.item.id ?? null,
      reason: candidateReason(facts),
      nextCheck: candidateNextCheck(facts),
    });
  });

  // mirror of the top spot across a single pass, as an alternative (docs/reference/locator-methods.md §5.3)
  function addMirrorSpot(found: FoundSource[]): FoundSource[] {
    if (found.length === 0 || found.length >= o.maxCandidates) return found;
    const top = found[0];
    const [x, y0] = cellCentre(grid, top.cell);
    const sup = support(top.column, greedy.fit.b, y);
    const side = oneSidedPass(
      sup.map((i) => xs[i]),
      sup.map((i) => ys[i]),
      x,
      y0,
    );
    if (!side.oneSided) return found;
    const [mx, my] = side.mirror;
    if (mx < 0 || my < 0 || mx > plan.width || my > plan.height) return found;
    const mc = cellIndexOf(grid, mx, my);
    if (!allowed[mc] || found.some((f) => cellDistance(f.cell, mc, grid.width) * grid.cellSize < o.separationM))
      return found;
    const mirror: FoundSource = {
      cell: mc,
      delta: greedy.firstScan.delta[mc],
      column: kernelColumn(fields, mc, n),
      alternate: true,
      q: greedy.firstScan.q[mc],
      surface: greedy.firstScan.delta,
    };
    return [top, mirror, ...found.slice(1)].slice(0, o.maxCandidates);
  }

  // 6. diagnostics
  const diagnostics: Diagnostic[] = [];
  for (const f of plan.fixtures) {
    const d = fansMixing(f, xs, ys, y, background.ppm, instrument.alarmPpm);
    if (d) diagnostics.push(d);
  }
  plan.backgroundZones.forEach((zone, z) => {
    let explained = 0;
    let peak = 0;
    for (let i = 0; i < n; i++) {
      if (zoneOfReading[i] === z && y[i] - background.ppm >= o.elevatedPpm) {
        explained++;
        peak = Math.max(peak, y[i]);
      }
    }
    const d = greedy.fit.q[z] > 0 ? benignSource(zone, explained, peak) : null;
    if (d) diagnostics.push(d);
  });
  const coverage = sparseCoverage(
    Float64Array.from(readings, (r) => r.x),
    Float64Array.from(readings, (r) => r.y),
    o.coverageGapM,
  );
  if (coverage) diagnostics.push(coverage);
  if (oneSidedTop) {
    diagnostics.push({
      kind: "one-sided-pass",
      message:
        "The top suspect spot is seen from one pass only, so which side of the path it is on cannot be told: make a pass along the other face.",
    });
  }
  const early = lagged.filter((l) => l.beforeDelay).length;
  if (early > 0) {
    diagnostics.push({
      kind: "early-readings",
      message: `${early} reading${early > 1 ? "s were" : " was"} taken before one delay (${round2(instrument.transportDelayS + instrument.timeConstantS)} s) had passed and ${early > 1 ? "are" : "is"} placed at the first tap.`,
    });
  }
  const over = censored.reduce((a, b) => a + b, 0);
  if (over > 0) {
    diagnostics.push({
      kind: "over-range",
      message: `${over} reading${over > 1 ? "s were" : " was"} over range and counted as "at least" that value.`,
    });
  }

  const corrected: CorrectedReading[] = readings.map((r, i) => {
    const flags: ReadingFlag[] = [];
    if (lagged[i].beforeDelay) flags.push("before-delay");
    if (lagged[i].pathGap) flags.push("path-gap");
    if (grid.blocked[cellIndexOf(grid, xs[i], ys[i])]) flags.push("snapped");
    if (censored[i]) flags.push("over-range");
    if (zoneOfReading[i] >= 0) flags.push("in-benign-zone");
    return {
      index: i,
      raw: { x: r.x, y: r.y },
      corrected: { x: round2(xs[i]), y: round2(ys[i]) },
      t: r.t,
      ppm: r.ppm,
      flags,
    };
  });

  return {
    candidates,
    background: { ppm: round2(background.ppm) },
    diagnostics,
    assumptions: [
      `Readings moved back along the walk by the transport delay plus the sensor time constant (${round2(instrument.transportDelayS + instrument.timeConstantS)} s).`,
      `Strength in g/yr assumes the store air is well mixed over ${o.mixingHeightM} m height with ${o.airChangesPerH} air changes per hour, ` +
        `a refrigerant of ${o.molarMassGPerMol} g/mol and ${MOLAR_VOLUME_25C_L} L/mol (25 °C, 101.325 kPa); treat it as an order of magnitude.`,
      "Suspect spots are search zones for a hand check, not pinpoints; follow local codes and certified practice when working on the system.",
    ],
    readings: corrected,
    field,
  };
}

function medianOf(v: Float64Array): number {
  const s = Float64Array.from(v).sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Noise model: w = 1/(a + β·y)², an additive floor plus a multiplicative share. */
function weightsFor(y: Float64Array, o: LocatorOptions): Float64Array {
  return Float64Array.from(y, (v) => 1 / (o.noiseFloorPpm + o.noiseFraction * v) ** 2);
}

function cellDistance(a: number, b: number, width: number): number {
  const ai = a % width;
  const bi = b % width;
  return Math.hypot(ai - bi, (a - ai) / width - (b - bi) / width);
}

/** √(area/π) of the cells near `c` whose Δχ² is within `tolerance` of the value at c. */
function misfitRadius(delta: Float64Array, c: number, tolerance: number, width: number, cellSize: number): number {
  const reach = Math.ceil(6 / cellSize);
  const ci = c % width;
  const cj = (c - ci) / width;
  const height = delta.length / width;
  const floor = delta[c] - tolerance;
  let count = 0;
  for (let j = Math.max(0, cj - reach); j <= Math.min(height - 1, cj + reach); j++) {
    for (let i = Math.max(0, ci - reach); i <= Math.min(width - 1, ci + reach); i++) {
      if (delta[j * width + i] >= floor && delta[j * width + i] > 0) count++;
    }
  }
  return Math.sqrt((count * cellSize * cellSize) / Math.PI);
}

// Risk points of one fan-stirred room are listed as separate spots when at least this far apart: twice
// the 0.5 m reach of the risk-point prior, so two spots never name the same fitting.
const ROOM_RISK_SPACING_M = 1;

const round2 = (v: number) => Math.round(v * 100) / 100;
