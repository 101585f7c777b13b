import type { LocatorBackgroundZone, LocatorFixture } from "../../contracts/locator-input";
import type { LocatorDiagnostic } from "../../contracts/locator-output";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../geometry/segments";

const r2 = (v: number) => Math.round(v * 100) / 100;

function quantile(sorted: number[], p: number): number {
  const pos = (sorted.length - 1) * p;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

/** A reading this close to a fixture's outline was taken at it (a probe at the case front), m. */
export const MIXING_REACH_M = 0.3;

/**
 * Readings level and elevated across a whole fixture whose fans run: the fans spread the gas through
 * it, so no spot inside can be told from another. "Level" = the 10–90% spread is under half the median
 * excess (common practice, no published source).
 */
export function fansMixing(
  fixture: LocatorFixture,
  xs: Float64Array,
  ys: Float64Array,
  y: Float64Array,
  background: number,
  alarmPpm: number,
): LocatorDiagnostic | null {
  if (!fixture.fans) return null;
  const inside: number[] = [];
  for (let i = 0; i < xs.length; i++) {
    const p = [xs[i], ys[i]] as const;
    if (pointInPolygon(p, fixture.polygon) || distanceToPolygonEdge(p, fixture.polygon) <= MIXING_REACH_M)
      inside.push(y[i] - background);
  }
  if (inside.length < 4) return null;
  inside.sort((a, b) => a - b);
  const med = quantile(inside, 0.5);
  if (med < alarmPpm) return null;
  if (quantile(inside, 0.9) - quantile(inside, 0.1) > 0.5 * med) return null;
  return { kind: "fans-mixing", fixtureId: fixture.id, count: inside.length, levelPpm: r2(med + background) };
}

export function benignSource(zone: LocatorBackgroundZone, explained: number, peak: number): LocatorDiagnostic | null {
  if (explained === 0) return null;
  return { kind: "benign-source", zoneId: zone.id, note: zone.note || null, count: explained, peakPpm: r2(peak) };
}

/** Stretches between consecutive taps longer than `gapM`, where a leak could be walked past unseen. */
export function sparseCoverage(xs: Float64Array, ys: Float64Array, gapM: number): LocatorDiagnostic | null {
  let count = 0;
  let longest = 0;
  let at: [number, number] = [0, 0];
  for (let i = 1; i < xs.length; i++) {
    const d = Math.hypot(xs[i] - xs[i - 1], ys[i] - ys[i - 1]);
    if (d > gapM) {
      count++;
      if (d > longest) {
        longest = d;
        at = [(xs[i] + xs[i - 1]) / 2, (ys[i] + ys[i - 1]) / 2];
      }
    }
  }
  if (count === 0) return null;
  return { kind: "sparse-coverage", count, gapM, longestM: r2(longest), at: { x: r2(at[0]), y: r2(at[1]) } };
}

/**
 * Whether the readings that support a spot come from a single straight pass with the spot off to one
 * side: then the other side of the pass fits as well (mirror ambiguity, docs/reference/locator-methods.md §5.3).
 * Uses the principal axis of the supporting positions.
 */
export function oneSidedPass(
  sx: number[],
  sy: number[],
  cx: number,
  cy: number,
): { oneSided: boolean; mirror: [number, number] } {
  const n = sx.length;
  const none = { oneSided: false, mirror: [cx, cy] as [number, number] };
  if (n < 3) return none;
  const mx = sx.reduce((a, b) => a + b, 0) / n;
  const my = sy.reduce((a, b) => a + b, 0) / n;
  let sxx = 0,
    syy = 0,
    sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (sx[i] - mx) ** 2;
    syy += (sy[i] - my) ** 2;
    sxy += (sx[i] - mx) * (sy[i] - my);
  }
  const angle = 0.5 * Math.atan2(2 * sxy, sxx - syy);
  const ux = Math.cos(angle);
  const uy = Math.sin(angle);
  // perpendicular spread of the readings and offset of the spot from the pass line
  let perp2 = 0;
  let minPerp = Infinity;
  let maxPerp = -Infinity;
  for (let i = 0; i < n; i++) {
    const p = -(sx[i] - mx) * uy + (sy[i] - my) * ux;
    perp2 += p * p;
    minPerp = Math.min(minPerp, p);
    maxPerp = Math.max(maxPerp, p);
  }
  const spread = Math.sqrt(perp2 / n);
  const offset = -(cx - mx) * uy + (cy - my) * ux;
  // A single line of readings cannot tell a spot on one side from its mirror image on the other; a spot
  // on the line itself is just as ambiguous (it trades distance against strength).
  const oneSided = spread < 0.4 && !(offset < maxPerp + 0.3 && offset > minPerp - 0.3 && maxPerp - minPerp > 1.2);
  return { oneSided, mirror: Math.abs(offset) > 0.5 ? [cx + 2 * offset * uy, cy - 2 * offset * ux] : [cx, cy] };
}
