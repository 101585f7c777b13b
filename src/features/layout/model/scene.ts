/**
 * The layout editor's scene: plain readonly data (fixtures by id, their drawing order and the
 * selection) on a plan of known size. Views render it; only actions.ts's reducer changes it.
 */
import { pointInPolygon } from "#core/analysis/geometry/point-in-polygon";
import { distanceToPolygonEdge } from "#core/analysis/geometry/segments";
import type { Bounds } from "#core/analysis/geometry/types";
import { validateFixtureList, type FieldError, type Fixture, type PlanBounds } from "#core/contracts/fixtures";
import type { PlanPoint } from "../../../lib/plan-view/coordinates";
import { fixtureBounds } from "./fixture-geometry";

export interface Scene {
  /** The plan's size in metres; fixtures must lie within [0, width] × [0, height]. */
  readonly plan: PlanBounds;
  readonly fixtures: Readonly<Record<string, Fixture>>;
  /** Drawing order, bottom first; every id in `fixtures` appears once. */
  readonly order: readonly string[];
  /** Selected ids, in the order they were selected. */
  readonly selection: readonly string[];
}

export function createScene(plan: PlanBounds, fixtures: readonly Fixture[] = []): Scene {
  const byId: Record<string, Fixture> = {};
  for (const f of fixtures) {
    if (byId[f.id]) throw new Error(`fixture id ${f.id} appears twice`);
    byId[f.id] = f;
  }
  return { plan, fixtures: byId, order: fixtures.map((f) => f.id), selection: [] };
}

/** Fixtures in drawing order (what is saved, and what the list view shows). */
export function sceneFixtures(scene: Scene): Fixture[] {
  return scene.order.map((id) => scene.fixtures[id]);
}

export function selectedFixtures(scene: Scene): Fixture[] {
  return scene.selection.map((id) => scene.fixtures[id]).filter((f): f is Fixture => f !== undefined);
}

/** The same field errors a save would get from the server (see contracts/fixtures.ts). */
export function sceneErrors(scene: Scene): FieldError[] {
  const r = validateFixtureList(sceneFixtures(scene), scene.plan);
  return r.ok ? [] : r.errors;
}

/**
 * The topmost fixture under a plan point: inside a polygon, or within `toleranceM` of its
 * outline or of a point fixture (so thin walls and points can be picked). Points win over
 * polygons, since they sit on top of the cases they belong to.
 */
export function hitTest(scene: Scene, p: PlanPoint, toleranceM: number): string | null {
  let polygonHit: string | null = null;
  for (let i = scene.order.length - 1; i >= 0; i--) {
    const f = scene.fixtures[scene.order[i]];
    if ("point" in f) {
      if (Math.hypot(f.point.x - p.x, f.point.y - p.y) <= toleranceM) return f.id;
    } else if (
      polygonHit === null &&
      (pointInPolygon([p.x, p.y], f.polygon) || distanceToPolygonEdge([p.x, p.y], f.polygon) <= toleranceM)
    ) {
      polygonHit = f.id;
    }
  }
  return polygonHit;
}

/** Ids of fixtures lying wholly inside a box (marquee selection), in drawing order. */
export function fixturesInBox(scene: Scene, box: Bounds): string[] {
  return scene.order.filter((id) => {
    const b = fixtureBounds(scene.fixtures[id]);
    return b.minX >= box.minX && b.maxX <= box.maxX && b.minY >= box.minY && b.maxY <= box.maxY;
  });
}
