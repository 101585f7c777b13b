import { describe, expect, it } from "vitest";
import { posteriorRadius } from "./posterior-radius";

// A 9 x 9 grid of 1 m cells; the radius is where the weights added up outward from the spot reach the
// share, checked against hand arithmetic.
const W = 9;
const at = (i: number, j: number) => j * W + i;
const all = () => new Uint8Array(W * W).fill(1);

describe("radius holding a share of the tempered posterior", () => {
  it("is the spot's own cell when one cell holds the share (a sharp optimum)", () => {
    const delta = new Float64Array(W * W);
    delta[at(4, 4)] = 100;
    delta[at(5, 4)] = 20; // weight e^((20 − 100)/2) ≈ 4e-18 at T = 1
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 1, null, 0.5)).toBe(0);
  });

  it("grows along a flat ridge the readings cannot tell apart", () => {
    const delta = new Float64Array(W * W);
    for (let i = 0; i <= 8; i++) delta[at(i, 4)] = 50; // nine equal cells along the row j = 4
    // from the middle cell: 1 at 0 m, 3 within 1 m, 5 within 2 m, 7 within 3 m, 9 within 4 m
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 10, null, 0.5)).toBe(2); // 5/9 ≥ 0.5
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 10, null, 0.75)).toBe(3); // 7/9 ≥ 0.75
    // within a 2 m reach only five cells count: half of them lie within 1 m (3/5 ≥ 0.5)
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 2, 10, null, 0.5)).toBe(1);
  });

  it("follows the tempering: a hotter posterior spreads over a Δχ² step it ignored when cold", () => {
    const delta = new Float64Array(W * W);
    delta[at(4, 4)] = 40;
    delta[at(7, 4)] = 36; // 3 m off, Δχ² 4 lower: weight e^(−2) at T = 1, e^(−0.02) at T = 100
    // the spot holds 1/(1 + e^(−2)) = 0.88 of the weight when cold, 1/(1 + e^(−0.02)) = 0.505 when hot
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 1, null, 0.6)).toBe(0);
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 100, null, 0.6)).toBe(3);
  });

  it("weighs the prior and skips cells that are not allowed or fit no source", () => {
    const delta = new Float64Array(W * W);
    delta[at(4, 4)] = 10;
    delta[at(6, 4)] = 10;
    const prior = new Float64Array(W * W);
    prior[at(6, 4)] = Math.log(3); // odds 3:1 at the cell 2 m off: it holds 3/4 of the weight
    expect(posteriorRadius(delta, all(), at(4, 4), W, 1, 4, 1, prior, 0.5)).toBe(2);
    const allowed = all();
    allowed[at(6, 4)] = 0;
    expect(posteriorRadius(delta, allowed, at(4, 4), W, 1, 4, 1, prior, 0.5)).toBe(0);
    expect(posteriorRadius(new Float64Array(W * W), all(), at(4, 4), W, 1, 4, 1, null, 0.5)).toBe(0);
  });
});
