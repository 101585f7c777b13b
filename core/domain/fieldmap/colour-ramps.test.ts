import { describe, expect, it } from "vitest";
import { deltaE76, labInGamut, lightness, rgbToLab, simulateDeuteranopia, type Rgb } from "./colour-science";
import {
  CONCENTRATION_LUT,
  CONCENTRATION_STOPS,
  createConcentrationScale,
  LUT_SIZE,
  niceMaxPpm,
} from "./concentration-ramp";
import { createDifferenceScale, DIFFERENCE_LUT, DIFFERENCE_STOPS } from "./difference-ramp";

const entry = (lut: Uint8ClampedArray, i: number): Rgb => [lut[i * 3], lut[i * 3 + 1], lut[i * 3 + 2]];

describe("colour science against published values", () => {
  it("sRGB white and black have L* 100 and 0; mid grey #777777 is about 50", () => {
    // CIE 1976 L*, D65 white (CIE 15:2004); sRGB curve IEC 61966-2-1
    expect(lightness([255, 255, 255])).toBeCloseTo(100, 1);
    expect(lightness([0, 0, 0])).toBeCloseTo(0, 6);
    // #777777 → Y = 0.1845, L* = 116·Y^(1/3) − 16 = 50.03 (computed by hand from the formula)
    expect(lightness([119, 119, 119])).toBeCloseTo(50.0, 0);
  });

  it("sRGB red is L*a*b* (53.2, 80.1, 67.2)", () => {
    // Reference value for sRGB #ff0000 under D65 as tabulated by Lindbloom's calculator (brucelindbloom.com) — from memory to one decimal
    const [l, a, b] = rgbToLab([255, 0, 0]);
    expect(l).toBeCloseTo(53.24, 0);
    expect(a).toBeCloseTo(80.09, 0);
    expect(b).toBeCloseTo(67.2, 0);
  });

  it("deuteranopia leaves grey grey and maps red and green close together", () => {
    // Machado, Oliveira & Fernandes 2009: each row of the matrix sums to 1, so neutrals are unchanged
    expect(simulateDeuteranopia([128, 128, 128])).toEqual([128, 128, 128]);
    // the classic confusion pair: pure red vs a green of similar lightness collapse under deuteranopia
    const red: Rgb = [200, 60, 40];
    const green: Rgb = [110, 130, 40];
    expect(deltaE76(simulateDeuteranopia(red), simulateDeuteranopia(green))).toBeLessThan(deltaE76(red, green) / 3);
  });
});

describe("concentration ramp", () => {
  it("has every stop inside the sRGB gamut", () => {
    for (const [l, a, b] of CONCENTRATION_STOPS) expect(labInGamut(l, a, b)).toBe(true);
  });

  it("is strictly monotonic in CIE L* from the lowest ppm to the highest", () => {
    // CIE 1976 L* via sRGB → linear (IEC 61966-2-1) → XYZ D65 → L*
    let previous = Infinity;
    for (let i = 0; i < LUT_SIZE; i++) {
      const l = lightness(entry(CONCENTRATION_LUT, i));
      expect(l).toBeLessThan(previous);
      previous = l;
    }
    expect(lightness(entry(CONCENTRATION_LUT, 0)) - lightness(entry(CONCENTRATION_LUT, LUT_SIZE - 1))).toBeGreaterThan(
      70,
    );
  });

  it("keeps its ends far apart under simulated deuteranopia", () => {
    // Machado, Oliveira & Fernandes 2009 (severity 1.0); ΔE*ab CIE 1976; a ΔE of about 2.3 is a just-noticeable
    // difference (Sharma, Digital Color Imaging Handbook 2003) — we ask for far more
    const lo = simulateDeuteranopia(entry(CONCENTRATION_LUT, 0));
    const hi = simulateDeuteranopia(entry(CONCENTRATION_LUT, LUT_SIZE - 1));
    expect(deltaE76(lo, hi)).toBeGreaterThan(60);
    // neighbouring steps of a tenth of the ramp stay distinguishable too
    for (let i = 0; i + 25 < LUT_SIZE; i += 25) {
      expect(
        deltaE76(
          simulateDeuteranopia(entry(CONCENTRATION_LUT, i)),
          simulateDeuteranopia(entry(CONCENTRATION_LUT, i + 25)),
        ),
      ).toBeGreaterThan(4);
    }
  });

  it("maps ppm linearly or on a symmetric log, clamped", () => {
    const lin = createConcentrationScale({ maxPpm: 500, log: false });
    expect(lin.position(250)).toBeCloseTo(0.5, 9);
    expect(lin.position(900)).toBe(1);
    expect(lin.position(-3)).toBe(0);
    const log = createConcentrationScale({ maxPpm: 500, log: true });
    // symlog: log1p(p)/log1p(500) (d3-scale's scaleSymlog with constant 1)
    expect(log.position(10)).toBeCloseTo(Math.log1p(10) / Math.log1p(500), 9);
    expect(log.ticks()).toEqual([0, 1, 10, 100, 500]);
    expect(() => createConcentrationScale({ maxPpm: 0, log: false })).toThrow(/maxPpm/);
  });

  it("picks a readable top of scale", () => {
    expect(niceMaxPpm(37)).toBe(50);
    expect(niceMaxPpm(500)).toBe(500);
    expect(niceMaxPpm(0.4, 2)).toBe(5);
  });
});

describe("difference ramp", () => {
  it("has every stop inside the sRGB gamut and is lightest at no change", () => {
    for (const [l, a, b] of DIFFERENCE_STOPS) expect(labInGamut(l, a, b)).toBe(true);
    const s = createDifferenceScale(100);
    const mid = lightness(s.colour(0));
    // L* falls monotonically from the middle to each end (CIE 1976 L*)
    let prev = mid;
    for (let d = 1; d <= 100; d += 3) {
      const l = lightness(s.colour(d));
      expect(l).toBeLessThanOrEqual(prev + 1e-9);
      prev = l;
    }
    prev = mid;
    for (let d = -1; d >= -100; d -= 3) {
      const l = lightness(s.colour(d));
      expect(l).toBeLessThanOrEqual(prev + 1e-9);
      prev = l;
    }
  });

  it("tells worse from better under simulated deuteranopia", () => {
    // Machado, Oliveira & Fernandes 2009 (severity 1.0)
    const worse = simulateDeuteranopia(entry(DIFFERENCE_LUT, LUT_SIZE - 1));
    const better = simulateDeuteranopia(entry(DIFFERENCE_LUT, 0));
    expect(deltaE76(worse, better)).toBeGreaterThan(40);
  });
});
