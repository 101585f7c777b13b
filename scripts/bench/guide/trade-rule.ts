// The trade's way after an alarm, as a policy the closed loop can run: the sample reached the display one
// delay late, so walk back to where you stood one delay before the alarm, then re-check every 0.6 m back
// along the case, holding the probe at each stop until the air drawn in there has reached the display,
// until the readings have peaked; the peak marks the leak in that case (common practice, no published
// source).
import { length, pointAt } from "../simulate/technician";
import type { FixtureSpec, Point } from "../simulate/store-types";
import type { World } from "../simulate/scenario";
import type { Policy, PolicyStep } from "./policy";

const RECHECK_SPACING_M = 0.6;
/** Readings falling this many stops in a row after the peak end the re-check. */
const FALLS_AFTER_PEAK = 2;
/** The re-check starts this many stops past where the gas was drawn in, towards the alarm. */
const STOPS_PAST_ORIGIN = 2;
/** How far the re-check goes at most while the readings still rise, back past the origin or on past the start (m). */
const BACK_PAST_ORIGIN_M = 8;

/**
 * How long a re-check holds the probe still: the stated delay plus two time constants, so the display
 * shows the air at this stop (86 % of a step, first-order response) rather than the last one's. A
 * technician who knows the detector waits for the reading to settle (common practice, no published source).
 */
export const holdS = (world: World) => world.instrument.transportDelayS + 2 * world.instrument.timeConstantS;

/**
 * Where one delay (hose delay plus response) before the alarm the technician stood: the latest stop at or
 * before that time, as the technician remembers the stops just walked.
 */
function originOf(stops: readonly { s: number; t: number }[], lagS: number): number {
  const alarm = stops[stops.length - 1];
  let origin = stops[0]?.s ?? 0;
  for (const stop of stops) if (stop.t <= alarm.t - lagS) origin = stop.s;
  return origin;
}

/**
 * The mark a technician puts on the plan for a peak read at probe position p: the middle of the case
 * section there, halfway between the probe (at the front) and the case back. The trade rule names the
 * case and the place along it; how deep in the case the leak is, it cannot tell. Outside a case (a
 * walk-in or machine room), the probe position itself.
 */
function markOnFixture(fixtures: readonly FixtureSpec[], p: { x: number; y: number }): { x: number; y: number } {
  const f = fixtures.find(
    (c) =>
      (c.kind === "open-case" || c.kind === "door-case" || c.kind === "island-case") &&
      p.x >= c.rect.x0 - 0.3 &&
      p.x <= c.rect.x1 + 0.3 &&
      p.y >= c.rect.y0 - 0.3 &&
      p.y <= c.rect.y1 + 0.3,
  );
  if (!f) return { x: p.x, y: p.y };
  const { x0, y0, x1, y1 } = f.rect;
  const clampX = Math.min(x1, Math.max(x0, p.x));
  const clampY = Math.min(y1, Math.max(y0, p.y));
  switch (f.back) {
    case "x0":
      return { x: (clampX + x0) / 2, y: clampY };
    case "x1":
      return { x: (clampX + x1) / 2, y: clampY };
    case "y0":
      return { x: clampX, y: (clampY + y0) / 2 };
    case "y1":
      return { x: clampX, y: (clampY + y1) / 2 };
    case "centre-y":
      return { x: clampX, y: (clampY + (y0 + y1) / 2) / 2 };
    case "centre-x":
      return { x: (clampX + (x0 + x1) / 2) / 2, y: clampY };
  }
}

export const tradeRule: Policy = {
  name: "trade rule",
  *run({ world, leg, alarmAtS }) {
    const pts: Point[] = leg.points;
    const tech = world.technician;
    const lagS = world.instrument.transportDelayS + world.instrument.timeConstantS;
    const origin = originOf(tech.lastStops, lagS);
    // Start a little past where the gas was drawn in, and walk back over the stretch behind it.
    const start = Math.min(length(pts), alarmAtS, origin + STOPS_PAST_ORIGIN * RECHECK_SPACING_M);
    const hold = holdS(world);
    // Back along the case from a little past the origin; if the readings have not peaked by the end
    // of that stretch (or of the case run, at the start of the leg), on forward past the start.
    const stops: number[] = [];
    for (let s = start; s >= Math.max(0, origin - BACK_PAST_ORIGIN_M) - 1e-9; s -= RECHECK_SPACING_M) stops.push(s);
    for (
      let s = start + RECHECK_SPACING_M;
      s <= Math.min(length(pts), start + BACK_PAST_ORIGIN_M);
      s += RECHECK_SPACING_M
    )
      stops.push(s);
    let best: { x: number; y: number; ppm: number } | null = null;
    let falls = 0;
    for (const s of stops) {
      const r = tech.probeAt(world.map, pointAt(pts, s), hold);
      if (!best || r.ppm > best.ppm) {
        best = { x: r.x, y: r.y, ppm: r.ppm };
        falls = 0;
      } else if (best.ppm >= world.instrument.alarmPpm && r.ppm < best.ppm) falls++;
      // Marked only once a re-check reaches the alarm: below it the rule has no peak to mark.
      const peaked = best !== null && best.ppm >= world.instrument.alarmPpm;
      const step: PolicyStep = { mark: peaked && best ? markOnFixture(world.layout.fixtures, best) : null };
      yield step;
      if (falls >= FALLS_AFTER_PEAK) return "marked";
    }
    // No re-check reading reached the alarm: a blip, and the sweep goes on.
    return best && best.ppm >= world.instrument.alarmPpm ? "marked" : "nothing";
  },
};
