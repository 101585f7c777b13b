import { describe, expect, it } from "vitest";
import { refineCell } from "./local-refine";

// A 9 x 9 grid of 1 m cells; the refinement is a weighted mean, checked against hand arithmetic.
const W = 9;
const at = (i: number, j: number) => j * W + i;

describe("local refinement of a suspect spot", () => {
  it("moves a spot on a flat ridge to the middle of the ridge (mean of equal weights)", () => {
    const delta = new Float64Array(W * W);
    for (let i = 2; i <= 6; i++) delta[at(i, 4)] = 100; // a ridge along the row j = 4
    delta[at(2, 4)] = 100.5; // the best cell is the ridge's end by a hair
    const allowed = new Uint8Array(W * W).fill(1);
    expect(refineCell(delta, allowed, at(2, 4), W, 1, 4, 100)).toBe(at(4, 4));
  });

  it("keeps a sharp optimum where it is when the temperature is low", () => {
    const delta = new Float64Array(W * W);
    delta[at(4, 4)] = 100;
    delta[at(5, 4)] = 50;
    delta[at(6, 4)] = 50;
    const allowed = new Uint8Array(W * W).fill(1);
    // weights 1, e^(−25), e^(−25): the mean stays within half a cell of (4, 4)
    expect(refineCell(delta, allowed, at(4, 4), W, 1, 3, 1)).toBe(at(4, 4));
  });

  it("never lands on a cell that is not allowed, and stays put when off", () => {
    const delta = new Float64Array(W * W);
    delta[at(3, 4)] = 10;
    delta[at(5, 4)] = 10;
    delta[at(4, 4)] = 10; // the mean of the three is (4, 4), which is not allowed
    const allowed = new Uint8Array(W * W).fill(1);
    allowed[at(4, 4)] = 0;
    const c = refineCell(delta, allowed, at(3, 4), W, 1, 3, 100);
    expect(allowed[c]).toBe(1);
    expect([at(3, 4), at(5, 4)]).toContain(c);
    expect(refineCell(delta, allowed, at(3, 4), W, 1, 0, 100)).toBe(at(3, 4));
  });

  it("with a prior, a level stretch goes to the favoured cells (posterior mean, hand arithmetic)", () => {
    const delta = new Float64Array(W * W);
    for (let i = 2; i <= 6; i++) delta[at(i, 4)] = 100; // readings cannot tell these five cells apart
    const allowed = new Uint8Array(W * W).fill(1);
    const prior = new Float64Array(W * W);
    prior[at(6, 4)] = Math.log(20); // a coil at (6, 4): odds 20:1 per cell
    // weights 1, 1, 1, 1, 20 at i = 2..6: mean i = (2 + 3 + 4 + 5 + 120) / 24 = 5.58, nearest cell i = 6
    expect(refineCell(delta, allowed, at(4, 4), W, 1, 4, 100, prior)).toBe(at(6, 4));
    // a sharp likelihood still wins over the prior: Δχ² 40 lower at the coil is e^(−40/2) against 20
    delta[at(6, 4)] = 60;
    delta[at(5, 4)] = 60;
    expect(refineCell(delta, allowed, at(3, 4), W, 1, 4, 1, prior)).toBe(at(3, 4));
  });
});
