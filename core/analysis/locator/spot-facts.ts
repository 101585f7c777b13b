import type { LocatorFixture, LocatorRiskPoint } from "../../contracts/locator-input";
import type { SpotNextCheck, SpotReason } from "../../contracts/locator-output";
import type { Nearest } from "./nearest-features";

// Why a suspect spot is listed and what to check next, as facts; core/domain/locator-words/ words them.

/** Re-check spacing around a spot, m: about two feet, close enough for a sniffer probe held near joints (common practice, no published source). */
export const RECHECK_SPACING_M = 0.6;
/** A risk point this close (or within the radius) is named as the first place to look, m (common practice, no published source). */
const RISK_POINT_NEAR_M = 1.5;
/** A spot this close to a fixture whose fans run is in their stirred air, m. */
const IN_FAN_AIR_M = 0.5;

export interface SpotGeometry {
  alternate: boolean;
  oneReading: boolean;
  supportCount: number;
  peakPpm: number;
  backgroundPpm: number;
  fixture: Nearest<LocatorFixture> | null;
  riskPoint: Nearest<LocatorRiskPoint> | null;
  oneSided: boolean;
  radius: number;
}

const r2 = (v: number) => Math.round(v * 100) / 100;

export function spotReason(g: SpotGeometry): SpotReason {
  return {
    kind: g.oneReading ? "one-reading" : g.alternate ? "alternative" : "fitted",
    supportCount: g.supportCount,
    peakPpm: r2(g.peakPpm),
    backgroundPpm: r2(g.backgroundPpm),
    fixture: g.fixture ? { id: g.fixture.item.id, kind: g.fixture.item.kind, distanceM: r2(g.fixture.distance) } : null,
    oneSided: g.oneSided,
  };
}

export function spotNextChecks(g: SpotGeometry): SpotNextCheck[] {
  const checks: SpotNextCheck[] = [];
  if (g.riskPoint && g.riskPoint.distance <= Math.max(RISK_POINT_NEAR_M, g.radius)) {
    checks.push({
      kind: "risk-point-first",
      riskPointId: g.riskPoint.item.id,
      riskPointKind: g.riskPoint.item.kind,
      distanceM: r2(g.riskPoint.distance),
    });
  }
  const fx = g.fixture?.item;
  const withinM = r2(g.radius);
  if (fx && fx.fans && g.fixture!.distance <= IN_FAN_AIR_M) {
    checks.push({ kind: "stop-fans", fixtureId: fx.id, spacingM: RECHECK_SPACING_M, withinM });
  } else {
    checks.push({ kind: "grid-recheck", spacingM: RECHECK_SPACING_M, withinM });
  }
  if (g.oneSided) checks.push({ kind: "other-face" });
  return checks;
}
