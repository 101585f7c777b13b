/**
 * Changing a fixture's kind in the side panel. The id, label, system link, fans and geometry
 * stay; the properties only the new kind has get that kind's defaults (from new-fixture.ts),
 * and properties the new kind lacks are dropped. Outlines and points do not turn into each
 * other: a point kind changes only to another point kind.
 */
import { isPointKind, type FixtureKind } from "#core/contracts/fixture-kinds";
import type { Fixture } from "#core/contracts/fixtures";
import { newFixture } from "./new-fixture";
import { planPoint } from "../../../lib/plan-view/coordinates";

export function canChangeKind(f: Fixture, kind: FixtureKind): boolean {
  return isPointKind(kind) === "point" in f;
}

export function changeKind(f: Fixture, kind: FixtureKind): Fixture {
  if (f.kind === kind) return f;
  if (!canChangeKind(f, kind)) {
    throw new RangeError(
      `a ${f.kind} cannot become a ${kind}: ${"point" in f ? "points stay points" : "outlines stay outlines"}`,
    );
  }
  const geometry = "point" in f ? { point: planPoint(f.point.x, f.point.y) } : { polygon: f.polygon };
  const fresh = newFixture(kind, f.id, geometry, f.label);
  return { ...fresh, systemId: f.systemId, hasFans: f.hasFans } as Fixture;
}
