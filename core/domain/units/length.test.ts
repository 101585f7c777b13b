import { describe, expect, it } from "vitest";
import { feetToMetres, formatFeetInches, inchesToMetres, metresToFeet, toFeetInches } from "./length";
import { parseLength } from "./parse-length";

describe("feet and metres", () => {
  it("uses the exact international foot", () => {
    // NIST SP 811, B.8: 1 ft = 0.3048 m exactly, 1 in = 0.0254 m exactly.
    expect(feetToMetres(1)).toBe(0.3048);
    expect(feetToMetres(10)).toBeCloseTo(3.048, 12);
    expect(inchesToMetres(12)).toBeCloseTo(0.3048, 12);
    expect(metresToFeet(0.3048)).toBe(1);
    // NIST SP 811, B.8: 1 m = 3.280840 ft (rounded there to 7 significant digits).
    expect(metresToFeet(1)).toBeCloseTo(3.28084, 5);
  });
  it("round-trips without drift", () => {
    for (const ft of [0.5, 3, 12.25, 100, 1234.5]) expect(metresToFeet(feetToMetres(ft))).toBeCloseTo(ft, 10);
  });
});

describe("feet-and-inches formatting", () => {
  it("splits 12 ft 3 1/2 in", () => {
    // 12 ft 3.5 in = 147.5 in × 0.0254 m (NIST SP 811) = 3.7465 m.
    expect(formatFeetInches(3.7465)).toBe("12 ft 3 1/2 in");
    expect(toFeetInches(3.7465)).toEqual({ negative: false, feet: 12, inches: 3, numerator: 1, denominator: 2 });
  });
  it("reduces fractions and carries into the next foot", () => {
    expect(formatFeetInches(inchesToMetres(6.25), 4)).toBe("0 ft 6 1/4 in");
    expect(formatFeetInches(inchesToMetres(6.5), 8)).toBe("0 ft 6 1/2 in"); // 4/8 reduces to 1/2
    expect(formatFeetInches(inchesToMetres(23.9))).toBe("2 ft 0 in"); // 23.9 in → 24 in to the half inch
    expect(formatFeetInches(feetToMetres(5))).toBe("5 ft 0 in");
    expect(formatFeetInches(-inchesToMetres(14))).toBe("-1 ft 2 in");
  });
  it("rounds a quarter inch half up to the half inch", () => {
    expect(formatFeetInches(inchesToMetres(6.25))).toBe("0 ft 6 1/2 in");
    expect(formatFeetInches(inchesToMetres(6.24))).toBe("0 ft 6 in");
  });
  it("refuses an unsupported fraction", () => {
    expect(() => formatFeetInches(1, 3 as never)).toThrow(/denominator/);
  });
});

describe("parseLength", () => {
  const m = (inches: number) => inches * 0.0254; // NIST SP 811: 1 in = 0.0254 m
  it("reads metric lengths", () => {
    expect(parseLength("3.2 m", "ft")).toBeCloseTo(3.2, 12);
    expect(parseLength("320 cm", "ft")).toBeCloseTo(3.2, 12);
    expect(parseLength("3200mm", "ft")).toBeCloseTo(3.2, 12);
    expect(parseLength("2 metres", "ft")).toBe(2);
  });
  it("reads feet and inches in every usual spelling", () => {
    for (const text of ["12 ft 3 1/2 in", "12' 3.5\"", "12′ 3½″", "12ft 3 1/2", "12 feet 3.5 inches", "12' 3 1/2''"]) {
      expect(parseLength(text, "m")).toBeCloseTo(m(147.5), 12);
    }
    expect(parseLength("147 in", "m")).toBeCloseTo(m(147), 12);
    expect(parseLength('3 1/2"', "m")).toBeCloseTo(m(3.5), 12);
    expect(parseLength("10 ft", "m")).toBeCloseTo(3.048, 12);
  });
  it("reads a bare number in the default unit", () => {
    expect(parseLength("12.5", "m")).toBe(12.5);
    expect(parseLength("10", "ft")).toBeCloseTo(3.048, 12);
    expect(parseLength("12 1/2", "ft")).toBeCloseTo(12.5 * 0.3048, 12);
  });
  it("refuses what it cannot read, naming the field", () => {
    expect(() => parseLength("", "m", "calibration length")).toThrow(/^calibration length: is empty/);
    expect(() => parseLength("-3 m", "m")).toThrow(/negative/);
    expect(() => parseLength("1,5 m", "m")).toThrow(/decimal point/);
    expect(() => parseLength("12 3", "ft")).toThrow(/could not read/);
    expect(() => parseLength("3 furlongs", "ft")).toThrow(/could not read/);
    expect(() => parseLength("5 ft 13 in", "ft")).toThrow(/under 12/);
    expect(() => parseLength("1/0 in", "ft")).toThrow(/zero denominator/);
  });
});
