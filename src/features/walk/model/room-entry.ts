import type { Fixture } from "#core/contracts/fixtures";
import { pointInPolygon } from "#core/analysis/geometry/point-in-polygon";
import type { CautionPlace } from "#core/domain/safety/cautions";

/** The walk-in or machine room a point lies in, with the caution place it stands for. */
export function roomAt(
  fixtures: readonly Fixture[],
  x: number,
  y: number,
): { fixture: Fixture; place: CautionPlace } | null {
  for (const f of fixtures) {
    if ("point" in f) continue;
    if (f.kind !== "walk-in-cooler" && f.kind !== "walk-in-freezer" && f.kind !== "machine-room") continue;
    if (pointInPolygon([x, y], f.polygon))
      return { fixture: f, place: f.kind === "machine-room" ? "machine-room" : "walk-in" };
  }
  return null;
}

/**
 * Whether a tap enters a room: it is inside one and the previous reading was not in that room.
 * The caution is shown on entering, not on every tap inside.
 */
export function enteredRoom(
  fixtures: readonly Fixture[],
  previous: { x: number; y: number } | null,
  next: { x: number; y: number },
) {
  const now = roomAt(fixtures, next.x, next.y);
  if (!now) return null;
  const before = previous ? roomAt(fixtures, previous.x, previous.y) : null;
  return before?.fixture.id === now.fixture.id ? null : now;
}

/** The systems in a room: the one linked to the room itself and those of the fixtures inside it. */
export function roomSystemIds(fixtures: readonly Fixture[], room: Fixture): string[] {
  if ("point" in room) return room.systemId ? [room.systemId] : [];
  const ids = new Set<string>();
  if (room.systemId) ids.add(room.systemId);
  for (const f of fixtures) {
    if (f.id === room.id || !f.systemId) continue;
    const at: [number, number] = "point" in f ? [f.point.x, f.point.y] : centre(f.polygon);
    if (pointInPolygon(at, room.polygon)) ids.add(f.systemId);
  }
  return [...ids];
}

function centre(polygon: readonly (readonly [number, number])[]): [number, number] {
  const sx = polygon.reduce((s, p) => s + p[0], 0);
  const sy = polygon.reduce((s, p) => s + p[1], 0);
  return [sx / polygon.length, sy / polygon.length];
}
