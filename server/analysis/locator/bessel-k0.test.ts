import { describe, expect, it } from "vitest";
import { besselK0 } from "./bessel-k0";
import { createSourceKernel, kernelArea } from "./source-kernel";

describe("K0 kernel", () => {
  it("matches Abramowitz & Stegun Table 9.8 values", () => {
    expect(besselK0(1)).toBeCloseTo(0.42102, 5); // A&S 9.8.5-6 / Table 9.8 (locator-methods §4)
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
});
