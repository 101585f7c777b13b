import type { LocatorInput } from "../../contracts/locator-input";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../geometry/segments";

type Plan = LocatorInput["plan"];
type ProbeKind = "case-front" | "room-low" | "room-high" | "line-set";

/** A place a probe can go: a case front or grille, inside a walk-in or machine room, at a line-set drop. */
export interface ProbePlace {
  x: number;
  y: number;
  kind: ProbeKind;
  fixtureId: string | null;
}

/** How far outside a case's outline the probe tip is held, at the grille (m). */
const FRONT_OFFSET_M = 0.15;

const ROOMS = new Set(["walk-in", "machine-room"]);

/** Whether a point is open floor: on the plan, not inside a solid body or a fixture. */
export function isOpenFloor(plan: Plan): (x: number, y: number) => boolean {
  return (x, y) =>
    x > 0 &&
    y > 0 &&
    x < plan.width &&
    y < plan.height &&
    !plan.obstacles.some((o) => pointInPolygon([x, y], o.polygon)) &&
    !plan.fixtures.some((f) => pointInPolygon([x, y], f.polygon));
}

/**
 * Probe places within `reachM` of `near`: every `spacingM` along the open sides of each case (not
 * inside a solid body or another fixture), the middle of each walk-in and machine room whose walls
 * come within `roomReachM` (low and high) and each coil in it (high), and each line-set drop. The trade re-checks case fronts every 0.6 m (common practice, no
 * published source).
 */
export function probePlaces(
  plan: Plan,
  near: { x: number; y: number },
  reachM: number,
  spacingM = 0.6,
  roomReachM = reachM,
): ProbePlace[] {
  const within = (x: number, y: number) => Math.hypot(x - near.x, y - near.y) <= reachM;
  const open = isOpenFloor(plan);
  const out: ProbePlace[] = [];
  for (const f of plan.fixtures) {
    if (ROOMS.has(f.kind)) {
      const [cx, cy] = centroid(f.polygon);
      // A room counts when its walls come within reach: its gas leaves by the door, its fans mix it.
      if (roomWithin(f.polygon, near, roomReachM)) {
        out.push({ x: cx, y: cy, kind: "room-low", fixtureId: f.id });
        out.push({ x: cx, y: cy, kind: "room-high", fixtureId: f.id });
        // at each coil in the room: evaporator coils hang high, and a leak there is read in their air
        for (const p of plan.riskPoints)
          if (p.kind === "coil" && pointInPolygon([p.x, p.y], f.polygon))
            out.push({ x: p.x, y: p.y, kind: "room-high", fixtureId: f.id });
      }
      continue;
    }
    const ring = f.polygon;
    for (let k = 0; k < ring.length; k++) {
      const [ax, ay] = ring[k];
      const [bx, by] = ring[(k + 1) % ring.length];
      const len = Math.hypot(bx - ax, by - ay);
      if (len === 0) continue;
      // Outward normal of this side, whichever way the outline runs.
      let [nx, ny] = [(by - ay) / len, (ax - bx) / len];
      const mx = (ax + bx) / 2;
      const my = (ay + by) / 2;
      if (pointInPolygon([mx + nx * 0.05, my + ny * 0.05], ring)) [nx, ny] = [-nx, -ny];
      const steps = Math.max(1, Math.floor(len / spacingM));
      for (let s = 0; s < steps; s++) {
        const f0 = (s + 0.5) / steps;
        const x = ax + (bx - ax) * f0 + nx * FRONT_OFFSET_M;
        const y = ay + (by - ay) * f0 + ny * FRONT_OFFSET_M;
        if (within(x, y) && open(x, y)) out.push({ x, y, kind: "case-front", fixtureId: f.id });
      }
    }
  }
  for (const p of plan.riskPoints)
    if (p.kind === "line-set" && within(p.x, p.y)) out.push({ x: p.x, y: p.y, kind: "line-set", fixtureId: null });
  return out;
}

/** Whether a room's outline comes within `reachM` of `near` (or holds it). */
export function roomWithin(ring: readonly (readonly number[])[], near: { x: number; y: number }, reachM: number) {
  const polygon = ring.map(([x, y]) => [x, y] as [number, number]);
  return pointInPolygon([near.x, near.y], polygon) || distanceToPolygonEdge([near.x, near.y], polygon) <= reachM;
}

function centroid(ring: readonly (readonly number[])[]): [number, number] {
  const n = ring.length;
  return [ring.reduce((s, p) => s + p[0], 0) / n, ring.reduce((s, p) => s + p[1], 0) / n];
}
