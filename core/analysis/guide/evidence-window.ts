import type { LocatorInput } from "../../contracts/locator-input";
import { clipPolygonToRect } from "../geometry/clip-to-rect";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { signedArea } from "../geometry/polygon-area";

type Plan = LocatorInput["plan"];

/** A rectangle of the plan, m: left, top, width, height. */
export interface PlanBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The part of a sweep the live estimate looks at: the plan and readings inside `box`, moved to its corner. */
export interface EvidenceWindow {
  box: PlanBox;
  input: LocatorInput;
  /** Indices into the sweep's readings of those kept, in order. */
  kept: number[];
}

/** Alarm readings within this distance of the strongest one belong to its plume, m (common practice, no published source: a case lineup's section). */
export const CLUSTER_M = 8;

/**
 * The rectangle around the strongest reading outside every benign-source zone and the other readings
 * at or above the alarm within CLUSTER_M of it, grown by `marginM` on every side and clipped to the
 * plan; null when no such reading reaches the alarm yet. Fitting a spot only needs the readings its
 * plume can reach (the kernel is truncated at a few metres), so the live estimate fits this window
 * instead of the whole store and keeps its answer in step with every reading. A blip across the store
 * does not stretch the window.
 */
export function evidenceBox(input: LocatorInput, marginM: number): PlanBox | null {
  const { plan, readings, instrument } = input;
  const benign = (x: number, y: number) => plan.backgroundZones.some((z) => pointInPolygon([x, y], z.polygon));
  let anchor = -1;
  readings.forEach((r, i) => {
    if (r.ppm < instrument.alarmPpm || benign(r.x, r.y)) return;
    if (anchor < 0 || r.ppm >= readings[anchor].ppm) anchor = i;
  });
  if (anchor < 0) return null;
  const a = readings[anchor];
  let [x0, y0, x1, y1] = [a.x, a.y, a.x, a.y];
  for (const r of readings) {
    if (r.ppm < instrument.alarmPpm || Math.hypot(r.x - a.x, r.y - a.y) > CLUSTER_M) continue;
    x0 = Math.min(x0, r.x);
    y0 = Math.min(y0, r.y);
    x1 = Math.max(x1, r.x);
    y1 = Math.max(y1, r.y);
  }
  const left = Math.max(0, x0 - marginM);
  const top = Math.max(0, y0 - marginM);
  const right = Math.min(plan.width, x1 + marginM);
  const bottom = Math.min(plan.height, y1 + marginM);
  return { x: left, y: top, width: Math.max(right - left, 0.5), height: Math.max(bottom - top, 0.5) };
}

/** Outlines smaller than this after clipping are dropped: a sliver at the window's edge holds no cell (m²). */
const MIN_AREA_M2 = 1e-4;

/**
 * The input cut to `box`: obstacles, fixtures and zones clipped to it, risk points and readings inside
 * it, everything moved so the box's corner is the origin. Readings keep their times (and so their order)
 * and their passes.
 */
export function cutToWindow(input: LocatorInput, box: PlanBox): EvidenceWindow {
  const { plan } = input;
  const clip = (polygon: readonly (readonly number[])[]) => {
    const moved = polygon.map(([x, y]) => [x - box.x, y - box.y] as [number, number]);
    const ring = clipPolygonToRect(moved, box.width, box.height);
    return ring.length >= 3 && Math.abs(signedArea(ring)) >= MIN_AREA_M2 ? ring : null;
  };
  const inside = (x: number, y: number) =>
    x >= box.x && x <= box.x + box.width && y >= box.y && y <= box.y + box.height;
  const cut: Plan = {
    width: box.width,
    height: box.height,
    obstacles: plan.obstacles.flatMap((o) => {
      const polygon = clip(o.polygon);
      return polygon ? [{ ...o, polygon }] : [];
    }),
    fixtures: plan.fixtures.flatMap((f) => {
      const polygon = clip(f.polygon);
      return polygon ? [{ ...f, polygon }] : [];
    }),
    riskPoints: plan.riskPoints.filter((p) => inside(p.x, p.y)).map((p) => ({ ...p, x: p.x - box.x, y: p.y - box.y })),
    backgroundZones: plan.backgroundZones.flatMap((z) => {
      const polygon = clip(z.polygon);
      return polygon ? [{ ...z, polygon }] : [];
    }),
  };
  const kept: number[] = [];
  const readings: LocatorInput["readings"] = [];
  input.readings.forEach((r, i) => {
    if (!inside(r.x, r.y)) return;
    kept.push(i);
    readings.push({ ...r, x: r.x - box.x, y: r.y - box.y });
  });
  // the passes travel with their readings: a pass over a fixture outside the window changes no air in it
  return { box, kept, input: { plan: cut, instrument: input.instrument, readings, passes: input.passes } };
}
