import { describe, expect, it } from "vitest";
import { filterFirstOrder, firstOrderStep, unfilterFirstOrder } from "./first-order-sensor";

describe("first-order sensor response", () => {
  it("reaches 63.2% of a step at one time constant (1 − 1/e, any control textbook, e.g. Ogata, Modern Control Engineering, §5-2)", () => {
    expect(firstOrderStep(2, 2)).toBeCloseTo(0.6321, 4);
    // a unit step just after t = 0, held between samples: the discrete response is exact at each sample
    const times = [0, 1e-12, 0.5, 1, 1.5, 2];
    const y = filterFirstOrder(times, [0, 1, 1, 1, 1, 1], 2);
    expect(y[5]).toBeCloseTo(0.6321, 4);
    expect(y[2]).toBeCloseTo(1 - Math.exp(-0.25), 9);
  });

  it("has a mean delay equal to its time constant, which the lag shift adds to the hose delay", () => {
    // ∫ t·h(t) dt with h(t) = e^(−t/τ)/τ equals τ; midpoint rule
    const tau = 1.5;
    let m = 0;
    for (let t = 0.0005; t < 40; t += 0.001) m += t * (Math.exp(-t / tau) / tau) * 0.001;
    expect(m).toBeCloseTo(tau, 4);
  });

  it("and its exact inverse round-trip on noiseless data (docs/reference/locator-methods.md §4)", () => {
    const times = [0, 0.7, 2.1, 2.5, 4.0, 5.2];
    const u = [0, 3, 8, 2, 0, 1];
    const y = filterFirstOrder(times, u, 1.3);
    const back = unfilterFirstOrder(times, y, 1.3);
    for (let k = 0; k < u.length - 1; k++) expect(back[k]).toBeCloseTo(u[k], 9);
  });
});
