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
