/**
 * Making copies of fixtures: duplicates with an offset and arrays (rows of identical cases).
 * New ids come from the caller, so the reducer stays pure and replays give the same ids.
 */
import type { Fixture } from "#core/contracts/fixtures";
import { translateFixture } from "./fixture-geometry";

/**
 * The label of the k-th copy: a trailing number counts on ("Dairy 3" → "Dairy 4", keeping
 * zero padding: "C09" → "C10"); other labels are kept as they are.
 */
export function nextLabel(label: string, k: number): string {
  const m = /^(.*?)(\d+)$/.exec(label);
  if (!m) return label;
  const n = String(Number(m[2]) + k).padStart(m[2].length, "0");
  return `${m[1]}${n}`;
}

export function copyFixture<F extends Fixture>(f: F, newId: string, dx: number, dy: number, k: number): F {
  return { ...translateFixture(f, dx, dy), id: newId, label: nextLabel(f.label, k) };
}

/**
 * `count` items in a row including the originals: copies k = 1..count-1 moved by
 * k × spacing along the unit vector of `direction`. `newIds[(k-1) * n + j]` is the id of
 * copy k of source j.
 */
export function arrayCopies(
  sources: readonly Fixture[],
  count: number,
  spacing: number,
  direction: readonly [number, number],
  newIds: readonly string[],
): Fixture[] {
  const len = Math.hypot(direction[0], direction[1]);
  const ux = direction[0] / len;
  const uy = direction[1] / len;
  const out: Fixture[] = [];
  for (let k = 1; k < count; k++) {
    sources.forEach((f, j) => {
      out.push(copyFixture(f, newIds[(k - 1) * sources.length + j], k * spacing * ux, k * spacing * uy, k));
    });
  }
  return out;
}
