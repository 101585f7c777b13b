/**
 * Making copies of fixtures: duplicates with an offset and arrays (rows of identical cases).
 * New ids come from the caller, so the reducer stays pure and replays give the same ids; the
 * copies' labels are numbered against the labels already on the plan (copy-labels.ts).
 */
import type { Fixture } from "#core/contracts/fixtures";
import { copyLabels } from "./copy-labels";
import { translateFixture } from "./fixture-geometry";

function copyFixture<F extends Fixture>(f: F, newId: string, dx: number, dy: number, label: string): F {
  return { ...translateFixture(f, dx, dy), id: newId, label };
}

/** One copy of each source moved by (dx, dy); `newIds[j]` is the id of source j's copy. */
export function duplicateCopies(
  sources: readonly Fixture[],
  dx: number,
  dy: number,
  newIds: readonly string[],
  onPlan: readonly Fixture[],
): Fixture[] {
  const labels = copyLabels(
    sources.map((f) => f.label),
    1,
    onPlan.map((f) => f.label),
  );
  return sources.map((f, j) => copyFixture(f, newIds[j], dx, dy, labels[j][0]));
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
  onPlan: readonly Fixture[],
): Fixture[] {
  const len = Math.hypot(direction[0], direction[1]);
  const ux = direction[0] / len;
  const uy = direction[1] / len;
  const labels = copyLabels(
    sources.map((f) => f.label),
    count - 1,
    onPlan.map((f) => f.label),
  );
  const out: Fixture[] = [];
  for (let k = 1; k < count; k++) {
    sources.forEach((f, j) => {
      const id = newIds[(k - 1) * sources.length + j];
      out.push(copyFixture(f, id, k * spacing * ux, k * spacing * uy, labels[j][k - 1]));
    });
  }
  return out;
}
