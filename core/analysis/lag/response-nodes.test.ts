import { describe, expect, it } from "vitest";
import { lagCorrect } from "./lag-correct";
import { gaussLaguerre, responseNodes } from "./response-nodes";

describe("sensor response nodes (Gauss–Laguerre)", () => {
  it("integrate e^(−x)·x^k exactly up to degree 2n − 1: ∫₀^∞ x^k e^(−x) dx = k! (Abramowitz & Stegun 6.1.1, 25.4.45)", () => {
    const factorial = [1, 1, 2, 6, 24, 120];
    for (const n of [2, 3]) {
      const { x, w } = gaussLaguerre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        const sum = x.reduce((s, xi, i) => s + w[i] * xi ** k, 0);
        expect(sum).toBeCloseTo(factorial[k], 8);
      }
    }
  });

  it("with one node is the plain shift by the delay plus the time constant", () => {
    const line = Array.from({ length: 20 }, (_, k) => ({ x: k, y: 2, t: k }));
    const nodes = responseNodes(line, 3.5, 1.5, 1);
    const shifted = lagCorrect(line, 3.5, 1.5);
    expect(nodes.weights).toEqual([1]);
    for (let i = 0; i < line.length; i++) expect(nodes.xs[0][i]).toBeCloseTo(shifted[i].x, 12);
  });

  it("place the nodes at t − D − τ·x along a 1 m/s walk, with the mean back at t − D − τ", () => {
    const line = Array.from({ length: 30 }, (_, k) => ({ x: k, y: 2, t: k }));
    const nodes = responseNodes(line, 5, 2, 3);
    const { x } = gaussLaguerre(3);
    x.forEach((xi, m) => expect(nodes.xs[m][25]).toBeCloseTo(25 - 5 - 2 * xi, 9));
    const mean = nodes.weights.reduce((s, wm, m) => s + wm * nodes.xs[m][25], 0);
    expect(mean).toBeCloseTo(25 - 5 - 2, 9); // the response's mean delay is τ (first-order-sensor.test)
  });

  it("rejects a node count it has no rule for", () => {
    expect(() => responseNodes([{ x: 0, y: 0, t: 0 }], 5, 2, 4)).toThrow(/response nodes: 4/);
  });
});
