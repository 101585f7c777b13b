// The trade's way after an alarm, as a policy the closed loop can run: the sample reached the sensor
// one delay late, so walk back about one delay's worth of walking, then re-check every 0.6 m back
// along the case, holding the probe a few seconds at each stop, until the readings have peaked; the
// peak marks the leak (common practice, no published source).
import { length, pointAt } from "../simulate/technician";
import type { Point } from "../simulate/store-types";
import type { Policy, PolicyStep } from "./policy";

const RECHECK_SPACING_M = 0.6;
/** Readings falling this many stops in a row after the peak end the re-check. */
const FALLS_AFTER_PEAK = 2;

export const tradeRule: Policy = {
  name: "trade rule",
  *run({ world, leg, alarmAtS }) {
    const pts: Point[] = leg.points;
    const d = world.instrument.transportDelayS * world.technician.speed;
    // Start a little past where the gas was drawn in, and walk back over the stretch behind it.
    const start = Math.min(length(pts), alarmAtS - d + 2 * RECHECK_SPACING_M);
    let best: { x: number; y: number; ppm: number } | null = null;
    let falls = 0;
    for (let s = start; s >= Math.max(0, alarmAtS - d - 4); s -= RECHECK_SPACING_M) {
      const r = world.technician.probeAt(world.map, pointAt(pts, s));
      if (!best || r.ppm > best.ppm) {
        best = { x: r.x, y: r.y, ppm: r.ppm };
        falls = 0;
      } else if (best.ppm >= world.instrument.alarmPpm && r.ppm < best.ppm) falls++;
      const step: PolicyStep = { mark: best ? { x: best.x, y: best.y } : null };
      yield step;
      if (falls >= FALLS_AFTER_PEAK) return "marked";
    }
    // No re-check reading reached the alarm: a blip, and the sweep goes on.
    return best && best.ppm >= world.instrument.alarmPpm ? "marked" : "nothing";
  },
};
