// The pinpoint-pass family's second pass. After sweeping every leg with the fans running, the
// technician picks a case, stops its fans at the controller and waits 3–6 min for the air to settle,
// then re-checks that case's front at the re-check's spacing and pace in still air (the gas field
// solved again without those fans). The pass's readings carry its id. The case is either handed in as
// data (a harness outside simulate/ may ask the product which case it advises: this folder never sees
// locator code), or chosen by the trade's rule of thumb: walk back one delay from the highest reading
// and take the case nearest that tap (common practice, no published source).
import type { Rect } from "./grid";
import type { Random } from "./random";
import type { FixtureSpec, Leg, StoreLayout } from "./store-types";
import { length, type Technician } from "./technician";
import type { WalkMap } from "./walk-path";

/** What the pass needs of a simulated store (scenario.ts's World). */
interface PassWorld {
  layout: StoreLayout;
  map: WalkMap;
  technician: Technician;
  random: Random;
  /** The detector's stated transport delay, s. */
  delayS: number;
  stopFans(fixtureId: string): void;
}

export const PASS_ID = "p2";

/**
 * The second pass over `chosen` (a case's fixture id), or, when none is given or it names no case of
 * the store, over the case the trade's rule picks.
 */
export function stillAirPass(
  world: PassWorld,
  chosen: string | null = null,
): { id: string; fans: "stopped"; fixture: string } {
  const tech = world.technician;
  const readings = tech.readings;
  const cases = world.layout.fixtures.filter(
    (f) => f.kind === "open-case" || f.kind === "door-case" || f.kind === "island-case",
  );
  const target = cases.find((f) => f.id === chosen) ?? tradeRuleCase(world, cases);
  const { leg, fromS, toS } = frontOf(world.layout.legs, target);
  const first = readings.length;
  tech.pause(world.random.uniform(180, 360));
  world.stopFans(target.id);
  tech.recheckSpan(world.map, leg, fromS, toS);
  for (let i = first; i < readings.length; i++) readings[i].pass = PASS_ID;
  return { id: PASS_ID, fans: "stopped", fixture: target.id };
}

/** The trade's rule: the peak's gas was drawn in about one (stated) delay earlier; the case nearest where the probe was then. */
function tradeRuleCase(world: PassWorld, cases: readonly FixtureSpec[]): FixtureSpec {
  const readings = world.technician.readings;
  const top = readings.reduce((a, r) => (r.ppm > a.ppm ? r : a), readings[0]);
  const back = top.t - world.delayS;
  const peak = readings.reduce((a, r) => (r.t <= top.t && Math.abs(r.t - back) < Math.abs(a.t - back) ? r : a), top);
  return cases.reduce((a, f) => (rectDistance(f.rect, peak) < rectDistance(a.rect, peak) ? f : a), cases[0]);
}

function rectDistance(r: Rect, p: { x: number; y: number }): number {
  return Math.hypot(Math.max(r.x0 - p.x, 0, p.x - r.x1), Math.max(r.y0 - p.y, 0, p.y - r.y1));
}

/** The stretch of the sweep leg that runs along a case's front: its arc lengths, half a metre past each end. */
function frontOf(legs: readonly Leg[], f: FixtureSpec): { leg: Leg; fromS: number; toS: number } {
  const cx = (f.rect.x0 + f.rect.x1) / 2;
  const cy = (f.rect.y0 + f.rect.y1) / 2;
  let best = { d: Infinity, leg: legs[0], s: 0, half: 0 };
  for (const leg of legs) {
    let along = 0;
    for (let k = 1; k < leg.points.length; k++) {
      const [ax, ay] = leg.points[k - 1];
      const [bx, by] = leg.points[k];
      const len = Math.hypot(bx - ax, by - ay);
      if (len > 0) {
        const [ux, uy] = [(bx - ax) / len, (by - ay) / len];
        const g = Math.max(0, Math.min(len, (cx - ax) * ux + (cy - ay) * uy));
        const d = Math.hypot(ax + g * ux - cx, ay + g * uy - cy);
        if (d < best.d) {
          const half = (Math.abs(ux) * (f.rect.x1 - f.rect.x0) + Math.abs(uy) * (f.rect.y1 - f.rect.y0)) / 2;
          best = { d, leg, s: along + g, half };
        }
      }
      along += len;
    }
  }
  const total = length(best.leg.points);
  return {
    leg: best.leg,
    fromS: Math.max(0, best.s - best.half - 0.5),
    toS: Math.min(total, best.s + best.half + 0.5),
  };
}
