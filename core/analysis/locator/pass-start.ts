import type { LaggedPosition } from "../lag/lag-correct";
import type { ReadingAir } from "./pass-air";

/**
 * The readings of a pinpoint pass taken less than one delay after the pass began (decision 0133). A pass
 * starts a new walk, so the lag correction places them at the pass's first tap (lag/lag-correct.ts), but
 * the probe drew their air on the unrecorded walk to it, in the first pass's air, while the fans were
 * being stopped: neither the place nor the air is the pass's. Fitted there with the still-air kernel, a
 * few such readings argue against the very spot the pass was made to confirm. They stay on the map and
 * in the background; no point source is fitted to them. Null when there are none.
 */
export function passStartReadings(
  air: Pick<ReadingAir, "modelOfReading">,
  positions: readonly Pick<LaggedPosition, "beforeDelay">[],
): Uint8Array | null {
  const n = air.modelOfReading.length;
  if (positions.length !== n) throw new Error("pass start: need one lagged position per reading");
  const early = new Uint8Array(n);
  let any = false;
  for (let i = 0; i < n; i++)
    if (air.modelOfReading[i] > 0 && positions[i].beforeDelay) {
      early[i] = 1;
      any = true;
    }
  return any ? early : null;
}

/** Readings fitted by no point source: the union of two such masks (either may be absent). */
export function unfitted(a: Uint8Array | null | undefined, b: Uint8Array | null | undefined): Uint8Array | undefined {
  if (!a) return b ?? undefined;
  if (!b) return a;
  return Uint8Array.from(a, (v, i) => (v || b[i] ? 1 : 0));
}

/**
 * Fewer fitted readings than this in a pass (after its first delay) cannot place a spot: one reading
 * gives no direction. Measured on the pinpoint-pass family's stores 1–12 and 8601–8615
 * (docs/benchmarks.md, decision 0133): 3 did as well on 8601–8615 and better on one tuning store, 4 worse.
 */
export const MIN_PASS_READINGS = 2;

/**
 * The readings of each still-air pass too thin to place a spot (fewer than MIN_PASS_READINGS left after
 * its first delay): no point source is fitted to any of them, and `allThin` says every pass is so, when
 * the stilled fixture's first-pass readings must keep their kernel (mixed-level.ts would otherwise take
 * them as a level that nothing then places). Null when no pass is thin.
 */
export function thinPasses(
  air: Pick<ReadingAir, "models" | "modelOfReading">,
  early: Uint8Array | null,
): { readonly readings: Uint8Array; readonly allThin: boolean } | null {
  const fitted = new Int32Array(air.models.length);
  air.modelOfReading.forEach((m, i) => {
    if (!early?.[i]) fitted[m]++;
  });
  const thin = (m: number) => m > 0 && fitted[m] < MIN_PASS_READINGS;
  const passes = air.models.map((_, m) => m).filter((m) => m > 0);
  if (!passes.some(thin)) return null;
  return {
    readings: Uint8Array.from(air.modelOfReading, (m) => (thin(m) ? 1 : 0)),
    allThin: passes.every(thin),
  };
}
