/** Small fixture builders shared by the model's tests (an invented store's cases and rooms). */
import type { PlainFixture, PointFixture, RoomFixture, Vertex } from "#core/contracts/fixtures";

export const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;

/** Sequential UUIDs from 1000 up, for actions that need new ids. */
export function idSource(start = 1000): () => string {
  let n = start;
  return () => uuid(n++);
}

export const rect = (x: number, y: number, w: number, h: number): Vertex[] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

export function openCase(n: number, polygon: Vertex[], label = `Case ${n}`): PlainFixture {
  return { id: uuid(n), kind: "open-case", label, systemId: null, hasFans: true, polygon };
}

export function room(
  n: number,
  polygon: Vertex[],
  door: RoomFixture["door"],
  kind: RoomFixture["kind"] = "walk-in-cooler",
): RoomFixture {
  return { id: uuid(n), kind, label: `Room ${n}`, systemId: null, hasFans: true, polygon, door };
}

export function valve(n: number, x: number, y: number): PointFixture {
  return { id: uuid(n), kind: "valve", label: `Valve ${n}`, systemId: null, hasFans: false, point: { x, y } };
}

export function closeTo(
  actual: readonly (readonly number[])[],
  expected: readonly (readonly number[])[],
  digits = 9,
): boolean {
  return (
    actual.length === expected.length &&
    actual.every((p, i) => p.every((v, j) => Math.abs(v - expected[i][j]) < 10 ** -digits))
  );
}
