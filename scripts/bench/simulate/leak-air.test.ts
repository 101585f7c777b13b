import { describe, expect, it } from "vitest";
import { buildWorld } from "./scenario";
import { storeStream } from "./store-types";

// Each leak's own air (for the second-leak oracle, scripts/bench/second-leak-oracle.ts) must add up to
// what the technician's probe samples: the gas equation is linear in its sources (transport.ts), and a
// two-leak store without an emitting benign zone has no other source.
describe("each leak's own air", () => {
  it("sums to the air the probe samples, one share per leak", () => {
    const world = buildWorld("two-leaks", storeStream("two-leaks", 1));
    const probe = (world.technician as unknown as { air: (x: number, y: number) => number }).air;
    let checked = 0;
    for (const leak of world.truth.leaks) {
      for (const [dx, dy] of [
        [0, 0],
        [0.6, 0],
        [0, -1.2],
        [2, 2],
      ]) {
        const shares = world.leakAir(leak.x + dx, leak.y + dy);
        expect(shares).toHaveLength(2);
        const sum = shares[0] + shares[1];
        expect(sum).toBeCloseTo(probe(leak.x + dx, leak.y + dy), 9);
        checked += sum > 0 ? 1 : 0;
      }
    }
    // the points near each leak carry gas, so the check compares real values, not zeros
    expect(checked).toBeGreaterThan(4);
  }, 60_000);
});
