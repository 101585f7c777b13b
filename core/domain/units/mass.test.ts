import { describe, expect, it } from "vitest";
import { kgToPounds, parseMass, poundsToKg } from "./mass";
import { formatLength, formatMass } from "./format-units";

describe("kg and lb", () => {
  it("uses the exact avoirdupois pound", () => {
    // NIST SP 811, B.8: 1 lb = 0.45359237 kg exactly.
    expect(poundsToKg(1)).toBe(0.45359237);
    expect(poundsToKg(50)).toBeCloseTo(22.6796185, 12);
    expect(poundsToKg(15)).toBeCloseTo(6.80388555, 12);
    // NIST SP 811, B.8: 1 kg = 2.204623 lb (rounded there to 7 significant digits).
    expect(kgToPounds(1)).toBeCloseTo(2.204623, 6);
    expect(kgToPounds(poundsToKg(123.4))).toBeCloseTo(123.4, 10);
  });
  it("parses typed masses", () => {
    expect(parseMass("12.5 kg", "lb")).toBe(12.5);
    expect(parseMass("1250 g", "lb")).toBeCloseTo(1.25, 12);
    expect(parseMass("27.5 lb", "kg")).toBeCloseTo(27.5 * 0.45359237, 12);
    // NIST SP 811, B.8: 1 oz = 28.349523125 g; 8 oz = 0.5 lb.
    expect(parseMass("27 lb 8 oz", "kg")).toBeCloseTo(27.5 * 0.45359237, 12);
    expect(parseMass("8 oz", "kg")).toBeCloseTo(8 * 0.028349523125, 12);
    expect(parseMass("10", "lb")).toBeCloseTo(4.5359237, 12);
    expect(parseMass("10", "kg")).toBe(10);
  });
  it("refuses bad masses by field", () => {
    expect(() => parseMass("", "kg", "amount")).toThrow(/^amount: is empty/);
    expect(() => parseMass("-2 kg", "kg")).toThrow(/negative/);
    expect(() => parseMass("2 lb 17 oz", "kg")).toThrow(/under 16/);
    expect(() => parseMass("two kg", "kg")).toThrow(/could not read/);
  });
});

describe("formatting by preference", () => {
  it("formats lengths", () => {
    expect(formatLength(3.7465, "ft-in")).toBe("12 ft 3 1/2 in");
    expect(formatLength(3.7465, "m")).toBe("3.75 m"); // half up: 3.7465 → 3.75 at 2 dp
    expect(formatLength(12, "m", { decimals: 1 })).toBe("12.0 m");
  });
  it("formats masses", () => {
    expect(formatMass(12.5, "kg")).toBe("12.50 kg");
    // 12.5 kg / 0.45359237 = 27.5578 lb (NIST SP 811 factor).
    expect(formatMass(12.5, "lb")).toBe("27.56 lb");
    expect(formatMass(poundsToKg(50), "lb", 0)).toBe("50 lb");
  });
});
