import { describe, expect, it } from "vitest";
import { besselK0 } from "./bessel-k0";
import { createSourceKernel, kernelArea } from "./source-kernel";

describe("K0 kernel", () => {
  it("matches Abramowitz & Stegun Table 9.8 values", () => {
    expect(besselK0(1)).toBeCloseTo(0.42102, 5); // A&S 9.8.5-6 / Table 9.8 (docs/reference/locator-methods.md §4)
    expect(besselK0(0.1)).toBeCloseTo(2.42707, 5); // A&S Table 9.8
    expect(besselK0(2)).toBeCloseTo(0.11389, 5); // from memory (A&S Table 9.8)
    expect(besselK0(5)).toBeCloseTo(0.0036911, 6); // from memory (A&S Table 9.8)
  });

  it("is continuous where the two approximations meet at x = 2", () => {
    expect(Math.abs(besselK0(2 - 1e-9) - besselK0(2 + 1e-9))).toBeLessThan(1e-6);
  });

  it("gives a source kernel of 1 at the near cut-off, 0 at the truncation radius, decreasing between", () => {
    const k = createSourceKernel(5, 0.5, 10);
    expect(k.at(0)).toBeCloseTo(1, 9);
    expect(k.at(0.5)).toBeCloseTo(1, 9);
    expect(k.at(10)).toBe(0);
    expect(k.at(3)).toBeGreaterThan(k.at(4));
    // ∫ K0(r/L)·2πr dr over the plane = 2πL² (Gradshteyn & Ryzhik 6.561.16 with μ = 1, ν = 0), by quadrature
    let integral = 0;
    const L = 5;
    for (let r = 0.00005; r < 200; r += 0.0001) integral += besselK0(r / L) * 2 * Math.PI * r * 0.0001;
    expect(integral / (2 * Math.PI * L * L)).toBeCloseTo(1, 3);
    expect(kernelArea(k)).toBeCloseTo((2 * Math.PI * 25) / besselK0(0.1), 9);
  });

  it("mixes a far-field part in by its share, both parts 1 at the cut-off and 0 at the truncation radius", () => {
    const k = createSourceKernel(1.5, 0.3, 6, { lengthM: 4, share: 0.3 });
    const part = (L: number, d: number) =>
      (besselK0(Math.max(d, 0.3) / L) - besselK0(6 / L)) / (besselK0(0.3 / L) - besselK0(6 / L));
    for (const d of [0.2, 1, 2.5, 4, 5.5]) expect(k.at(d)).toBeCloseTo(0.7 * part(1.5, d) + 0.3 * part(4, d), 4);
    expect(k.at(0.3)).toBeCloseTo(1, 9);
    expect(k.at(6)).toBe(0);
    // at 4 m the far part keeps about twice the gas the short kernel alone leaves
    expect(k.at(4)).toBeGreaterThan(1.5 * createSourceKernel(1.5, 0.3, 6).at(4));
    // the plane integral mixes the same way (2πL²/K0(d0/L) per part, as above)
    const area = (L: number) => (2 * Math.PI * L * L) / besselK0(0.3 / L);
    expect(kernelArea(k)).toBeCloseTo(0.7 * area(1.5) + 0.3 * area(4), 9);
    expect(() => createSourceKernel(1.5, 0.3, 6, { lengthM: 4, share: 1 })).toThrow(/share in \[0, 1\)/);
  });
});
