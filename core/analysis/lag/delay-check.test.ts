import { describe, expect, it } from "vitest";
import { checkDelay, DELAY_CHECK_SETTINGS } from "./delay-check";

// A technician walks a 20 m aisle east at 1 m/s, turns and walks back, a tap every half second; a leak at
// x = 10 m gives 1 + 20·exp(−|x − 10|) ppm. Each reading is the air drawn in `trueShift` seconds before
// the tap (a pure delay), rounded to whole ppm as a detector shows it. Straight walk, no route needed.
function sweep(trueShift: number) {
  const at = (t: number) => (t <= 20 ? t : 40 - t); // position along the aisle at time t
  const taps: { x: number; y: number; t: number; ppm: number }[] = [];
  for (let t = 0; t <= 40; t += 0.5) {
    const drawn = at(Math.max(0, t - trueShift));
    taps.push({ x: at(t), y: 1, t, ppm: Math.round(1 + 20 * Math.exp(-Math.abs(drawn - 10))) });
  }
  return taps;
}

describe("delay check", () => {
  it("finds the delay that lines up the passes there and back", () => {
    const c = checkDelay(sweep(3), 6, 1, undefined, undefined);
    expect(c.estimatedS).toBe(3);
    expect(c.supported).toBe(true);
    expect(c.estimatedMisfit!).toBeLessThan(c.statedMisfit!);
  });

  it("leaves a right delay alone", () => {
    const c = checkDelay(sweep(4), 4, 1, undefined, undefined);
    expect(c.estimatedS).toBe(4);
    expect(c.supported).toBe(false);
  });

  it("finds a longer delay than the stated one too", () => {
    const c = checkDelay(sweep(6), 2, 1, undefined, undefined);
    expect(c.estimatedS).toBe(6);
    expect(c.supported).toBe(true);
  });

  it("finds a delay under 0.4 of the stated one but does not take it as supported", () => {
    // 1 s against a stated 8 s: lined up as clearly as above, but a detector eight times faster than
    // stated is more likely a plume read on one pass (0.4 x 8 = 3.2 s > 1 s)
    const c = checkDelay(sweep(1), 8, 1, undefined, undefined);
    expect(c.estimatedS).toBe(1);
    expect(c.supported).toBe(false);
    // every other rule holds: without the share it would be taken
    const anyShare = { ...DELAY_CHECK_SETTINGS, minShareOfStated: 0 };
    expect(checkDelay(sweep(1), 8, 1, undefined, undefined, anyShare).supported).toBe(true);
    // the same readings against a stated 2 s: 1 s is half of it, and taken
    expect(checkDelay(sweep(1), 2.4, 1, undefined, undefined)).toMatchObject({ estimatedS: 1, supported: true });
  });

  it("takes a clear minimum on thin overlap, but not one far above the stated delay", () => {
    // every estimate counted as carried by too little pair weight, so only the thin-overlap rule can take it
    const thin = { ...DELAY_CHECK_SETTINGS, supportPairWeight: Number.POSITIVE_INFINITY };
    const halfStated = checkDelay(sweep(3), 6, 1, undefined, undefined, thin);
    expect(halfStated).toMatchObject({ estimatedS: 3, supported: true });
    expect(halfStated.estimatedMisfit!).toBeLessThanOrEqual(0.4 * halfStated.statedMisfit!);
    // the same readings with the bar for a thin minimum set at nothing: not taken
    expect(checkDelay(sweep(3), 6, 1, undefined, undefined, { ...thin, thinMaxMisfitRatio: 0 }).supported).toBe(false);
    // 6 s against a stated 2 s is three times the stated shift: found, not taken on thin overlap ...
    expect(checkDelay(sweep(6), 2, 1, undefined, undefined, thin)).toMatchObject({ estimatedS: 6, supported: false });
    // ... but taken where enough overlap carries it (the test above) or the cap allows it
    const wideCap = { ...thin, thinMaxShareOfStated: 3 };
    expect(checkDelay(sweep(6), 2, 1, undefined, undefined, wideCap).supported).toBe(true);
  });

  it("says nothing when no reading is raised or no spot is visited twice", () => {
    const flat = sweep(3).map((r) => ({ ...r, ppm: 1 }));
    expect(checkDelay(flat, 3, 1, undefined, undefined)).toMatchObject({ estimatedS: null, supported: false });
    const oneWay = sweep(3).slice(0, 41);
    expect(checkDelay(oneWay, 3, 1, undefined, undefined)).toMatchObject({ estimatedS: null, supported: false });
  });
});
