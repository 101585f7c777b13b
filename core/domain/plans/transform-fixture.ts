import { applySimilarity, type Similarity } from "../../analysis/geometry/similarity";
import type { Fixture } from "../../contracts/fixtures";

/**
 * Moves a fixture by a similarity (scale, rotation, offset): every vertex and point is mapped,
 * and lengths measured along an edge (a room door's offset and width) scale with it, so the door
 * stays on the same stretch of wall. Re-calibration is the case rotation 0, offset 0.
 */
export function transformFixture<F extends Fixture>(f: F, t: Similarity): F {
  if (![t.scale, t.rotation, t.tx, t.ty].every(Number.isFinite) || !(t.scale > 0)) {
    throw new RangeError(
      `a fixture transform needs a finite scale above 0 and a finite rotation and offset, got ${JSON.stringify(t)}`,
    );
  }
  if ("point" in f) {
    const [x, y] = applySimilarity(t, [f.point.x, f.point.y]);
    return { ...f, point: { x, y } };
  }
  const polygon = f.polygon.map((v) => applySimilarity(t, v));
  if ("door" in f && f.door) {
    return { ...f, polygon, door: { ...f.door, offset: f.door.offset * t.scale, width: f.door.width * t.scale } };
  }
  return { ...f, polygon };
}
