import type { FoundSource } from "../locator/greedy-sources";
import { kernelColumn } from "../locator/reading-fields";
import type { LagResult } from "./lag-stage";
import { supportingReadings, type SourcesResult, type SupportRule } from "./sources-stage";
import type { ZonesResult } from "./zones-stage";

/**
 * A spot from one reading: when a reading far above the alarm stands alone (no other reading that the
 * spot's air reaches rises over the background), no source fits, yet it is no clean sweep. The spot is the cell the reading can see
 * (kernel at least the support rule's threshold) where a source fits it best, with the risk-point prior,
 * on the first scan's Δχ² map; the presenter words it as one reading to re-check around, with a wide
 * radius. Taken only when no fitted spot exists at any delay tried (locate.ts), so it never outranks
 * evidence from several readings.
 */
export function oneReadingSource(
  lag: Pick<LagResult, "ppm" | "censored">,
  zones: Pick<ZonesResult, "zoneOfReading">,
  sources: Pick<SourcesResult, "fields" | "allowed" | "prior" | "firstScan" | "residualVariance">,
  rule: SupportRule,
  backgroundPpm: number,
  minPpm: number,
): FoundSource | null {
  const y = lag.ppm;
  let top = -1;
  for (let i = 0; i < y.length; i++) if (zones.zoneOfReading[i] < 0 && (top < 0 || y[i] > y[top])) top = i;
  if (top < 0 || !(y[top] >= minPpm)) return null;
  const { fields, allowed, prior, firstScan } = sources;
  const g = fields.groupOfReading[top];
  // the prior weighs as much as against data of the final fit's scatter (as in greedy-sources.ts)
  const s2 = sources.residualVariance;
  let best = -1;
  let bestScore = -Infinity;
  for (let e = fields.start[g]; e < fields.start[g + 1]; e++) {
    const c = fields.cell[e];
    if (!allowed[c] || fields.kernel[e] < rule.threshold) continue;
    const score = Math.max(0, firstScan.delta[c]) + 2 * s2 * (prior ? prior[c] : 0);
    if (score > bestScore) {
      bestScore = score;
      best = c;
    }
  }
  if (best < 0) return null;
  const column = kernelColumn(fields, best, y.length);
  // alone: no other reading it shares the spot with rises over the background (else it is a weak plume,
  // which the fitted sources' evidence rules judge)
  const support = supportingReadings(rule, column, backgroundPpm, y);
  if (support.length !== 1 || support[0] !== top) return null;
  return {
    cell: best,
    delta: Math.max(0, firstScan.delta[best]),
    column,
    alternate: false,
    oneReading: true,
    q: Math.max(0, firstScan.q[best]),
    surface: firstScan.delta,
  };
}
