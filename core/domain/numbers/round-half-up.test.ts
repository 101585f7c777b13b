import { describe, expect, it } from "vitest";
import { formatFixed, roundHalfUp } from "./round-half-up";

describe("roundHalfUp", () => {
  it("rounds the published blend halves up", () => {
    // docs/reference/standards.md §3 test notes: 2087.5 → 2088 (R-410A AR4) and 1824.5 → 1825 (R-407F AR4).
    expect(roundHalfUp(0.5 * 675 + 0.5 * 3500)).toBe(2088);
    expect(roundHalfUp(0.3 * 675 + 0.3 * 3500 + 0.4 * 1430)).toBe(1825);
  });
  it("differs from round-half-even where the tables do", () => {
    // Round half to even (IEEE 754 default, Python round) gives 2 for 2.5; tables give 3.
    expect(roundHalfUp(2.5)).toBe(3);
    expect(roundHalfUp(3.5)).toBe(4);
    expect(roundHalfUp(1.005, 2)).toBe(1.01); // (1.005).toFixed(2) is "1.00" in binary floating point
    expect(formatFixed(1.005, 2)).toBe("1.01");
  });
  it("keeps genuine values below the half", () => {
    expect(roundHalfUp(1773.85)).toBe(1774);
    expect(roundHalfUp(1824.49)).toBe(1824);
    expect(roundHalfUp(-2.5)).toBe(-3);
    expect(roundHalfUp(-0.4)).toBe(0);
  });
  it("refuses bad input by name", () => {
    expect(() => roundHalfUp(Number.NaN)).toThrow(/value: must be a finite number/);
    expect(() => roundHalfUp(1, 1.5)).toThrow(/decimals/);
  });
});
