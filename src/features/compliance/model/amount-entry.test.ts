import { describe, expect, it } from "vitest";
import { amountHint, readAmount } from "./amount-entry";

// The company formats are those of docs/decisions/0047; each reading is checked against the CLDR
// symbols of its locale through Intl.NumberFormat (en-US, de-DE, fr-FR).
const intl = (locale: string, v: number) =>
  new Intl.NumberFormat(locale, { maximumFractionDigits: 3 }).format(v).replace("\u2212", "-");

describe("readAmount", () => {
  it('reads "1.200,5" as twelve hundred and a half for a decimal-comma company and echoes it', () => {
    const r = readAmount("1.200,5", "kg", "1.234,5");
    expect(r).toEqual({ value: 1200.5, problem: null, echo: `${intl("de-DE", 1200.5)} kg` });
    expect(r.echo).toBe("1.200,5 kg");
  });

  it('reads "1,200" as twelve hundred for a decimal-point company, one point two for a decimal-comma one', () => {
    expect(readAmount("1,200", "lb", "1,234.5")).toMatchObject({ value: 1200, echo: `${intl("en-US", 1200)} lb` });
    expect(readAmount("1,200", "lb", "1.234,5")).toMatchObject({ value: 1.2, echo: "1,2 lb" });
    expect(readAmount("1 200,25", "kg", "1 234,5")).toMatchObject({
      value: 1200.25,
      echo: `${intl("fr-FR", 1200.25)} kg`,
    });
  });

  it("gives the reason instead of a guess, and NaN so nothing is sent", () => {
    const r = readAmount("12,00", "lb", "1,234.5");
    expect(r.value).toBeNaN();
    expect(r.echo).toBeNull();
    expect(r.problem).toMatch(/must group thousands in threes/);
    expect(readAmount("1.5", "kg", "1.234,5").problem).toMatch(/must group thousands in threes/);
    expect(readAmount("1.5", "kg", "1 234,5").problem).toMatch(/must use "," as the decimal mark/);
    expect(readAmount("", "kg", "1,234.5").problem).toBe("is empty");
  });

  it("hints what it read, or how to write a number", () => {
    const text = "2.500";
    expect(amountHint(text, readAmount(text, "kg", "1.234,5"), "1.234,5")).toBe("Read as 2.500 kg");
    expect(amountHint("", readAmount("", "kg", "1.234,5"), "1.234,5")).toBe("Written as 1.234,5");
  });
});
