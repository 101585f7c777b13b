import { describe, expect, it } from "vitest";
import { roundHalfUp } from "./round-half-up";
import {
  formatAsGiven,
  formatGrouped,
  formatQuantity,
  formatShort,
  formatSignificant,
  NUMBER_FORMATS,
  parseGroupedNumber,
  readGroupedNumber,
  type NumberFormat,
} from "./number-format";

const read = (text: string, format: NumberFormat) => {
  const r = parseGroupedNumber(text, format);
  return r.ok ? r.value : r.reason;
};

// The locale each format is written in, as the Unicode CLDR number symbols give it (via ICU in Intl):
// en-US "," and ".", de-DE "." and ",", fr-FR U+202F and ",".
const LOCALE: Record<NumberFormat, string> = { "1,234.5": "en-US", "1.234,5": "de-DE", "1 234,5": "fr-FR" };

describe("parseGroupedNumber (worked examples)", () => {
  it('reads "1,200 lb" as twelve hundred where the decimal mark is a point', () => {
    expect(read("1,200", "1,234.5")).toBe(1200);
    expect(read("1200", "1,234.5")).toBe(1200);
    expect(read("1,200.75", "1,234.5")).toBe(1200.75);
    expect(read("12,345,678.5", "1,234.5")).toBe(12345678.5);
    expect(read(".5", "1,234.5")).toBe(0.5);
    expect(read(" 45.3 ", "1,234.5")).toBe(45.3);
  });

  it('reads "1,200" as one point two in a decimal-comma format', () => {
    expect(read("1,200", "1.234,5")).toBe(1.2);
    expect(read("1.200", "1.234,5")).toBe(1200);
    expect(read("1.200,5", "1.234,5")).toBe(1200.5);
    expect(read("1,2", "1 234,5")).toBe(1.2);
    expect(read("1 200", "1 234,5")).toBe(1200);
    // Intl and word processors group with no-break spaces (U+00A0, U+202F).
    expect(read("1\u00a0200,5", "1 234,5")).toBe(1200.5);
    expect(read("1\u202f200,5", "1 234,5")).toBe(1200.5);
  });

  it("refuses what it would otherwise have to guess, with the reason", () => {
    expect(read("12,00", "1,234.5")).toMatch(/must group thousands in threes: in 1,234.5 the decimal mark is "\."/);
    expect(read("1,5", "1,234.5")).toMatch(/must group thousands in threes/);
    expect(read("1.5", "1.234,5")).toMatch(/decimal mark is ","/);
    expect(read("1.5", "1 234,5")).toMatch(
      /must use "," as the decimal mark, not "\." \(this company writes numbers as 1 234,5\)/,
    );
    expect(read("1.2.3", "1,234.5")).toMatch(/more than one decimal mark/);
    expect(read("1.234,5", "1,234.5")).toMatch(/thousands separator after the decimal mark|not a number/);
    expect(read("12 lb", "1,234.5")).toMatch(/not a number/);
    expect(read("1e3", "1,234.5")).toMatch(/not a number/);
    expect(read("", "1,234.5")).toBe("is empty");
    expect(read(",", "1.234,5")).toMatch(/no digits|not a number/);
    expect(read("1 200", "1,234.5")).toMatch(/not a number/);
  });

  it("keeps a sign, and gives a field error through readGroupedNumber", () => {
    expect(read("-1,200.5", "1,234.5")).toBe(-1200.5);
    expect(() => readGroupedNumber("12,00", "1,234.5", "fullCharge.value")).toThrow(/fullCharge.value/);
  });
});

describe("formatGrouped", () => {
  it("groups thousands as CLDR does for each locale (checked against Intl.NumberFormat)", () => {
    for (const format of NUMBER_FORMATS) {
      const intl = new Intl.NumberFormat(LOCALE[format], { minimumFractionDigits: 2, maximumFractionDigits: 2 });
      for (const v of [0, 7.25, 723.5, 1234.5, 1234567.89, -98765.43, 1000000]) {
        expect(formatGrouped(v, format, 2)).toBe(intl.format(v).replace("\u2212", "-"));
      }
    }
  });

  it("writes the worked examples", () => {
    expect(formatGrouped(1234567.891, "1,234.5", 2)).toBe("1,234,567.89");
    expect(formatGrouped(1234567.891, "1.234,5", 2)).toBe("1.234.567,89");
    expect(formatGrouped(1234567.891, "1 234,5", 2)).toBe("1\u202f234\u202f567,89");
    expect(formatGrouped(999.995, "1,234.5", 2)).toBe("1,000.00"); // half up, as the tables round
  });

  it("reads back what it writes, in every format", () => {
    // 3,000 values spread over twelve orders of magnitude, from a fixed linear congruential sequence.
    let seed = 12345;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let i = 0; i < 3000; i++) {
      const v = (next() - 0.5) * 10 ** Math.floor(next() * 12);
      const decimals = i % 4;
      for (const format of NUMBER_FORMATS) {
        expect(read(formatGrouped(v, format, decimals), format)).toBeCloseTo(roundHalfUp(v, decimals), decimals);
      }
    }
  });
});

describe("formatQuantity (sensible precision; common practice, no published source)", () => {
  it("never prints 723.50251 t, and drops trailing zeros", () => {
    expect(formatQuantity(723.50251, "1,234.5")).toBe("723.5");
    expect(formatQuantity(1200, "1.234,5")).toBe("1.200");
    expect(formatQuantity(2723.5, "1,234.5")).toBe("2,724");
    expect(formatQuantity(4.5359237, "1 234,5")).toBe("4,54");
    expect(formatQuantity(0.045359, "1,234.5")).toBe("0.045");
    expect(formatQuantity(12.0, "1,234.5")).toBe("12");
    expect(formatQuantity(1234.56, "1,234.5", 1)).toBe("1,234.6");
  });
});

describe("formatShort and formatSignificant (the locator's figures)", () => {
  it("round to what an estimate can claim, grouped as CLDR writes each locale (Intl.NumberFormat)", () => {
    for (const format of NUMBER_FORMATS) {
      const sig = new Intl.NumberFormat(LOCALE[format], { maximumSignificantDigits: 2 });
      for (const v of [319512, 3.456, 0.0123, 1234]) {
        expect(formatSignificant(v, 2, format)).toBe(sig.format(v));
      }
      const short = new Intl.NumberFormat(LOCALE[format], { maximumFractionDigits: 1 });
      for (const v of [12, 2.5, 0.3, 1234.56, 6.04]) expect(formatShort(v, format)).toBe(short.format(v));
    }
  });
});

describe("formatAsGiven (a typed figure, every place kept)", () => {
  it("writes as many places as were given, grouped as CLDR writes each locale (Intl.NumberFormat)", () => {
    for (const format of NUMBER_FORMATS) {
      for (const [v, places] of [
        [65.1, 1],
        [2500, 0],
        [12.125, 3],
        [1234.5, 1],
      ] as const) {
        const nf = new Intl.NumberFormat(LOCALE[format], {
          minimumFractionDigits: places,
          maximumFractionDigits: places,
        });
        expect(formatAsGiven(v, format)).toBe(nf.format(v));
      }
    }
  });
});
