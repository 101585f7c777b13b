import { describe, expect, it } from "vitest";
import { readLengthEntry } from "./length-entry";

describe("reading a typed real length", () => {
  it("keeps a bare number in the user's unit, exactly as typed", () => {
    expect(readLengthEntry("10", "ft-in")).toEqual({ ok: true, length: { value: 10, unit: "ft" } });
    expect(readLengthEntry(" 12.5 ", "m")).toEqual({ ok: true, length: { value: 12.5, unit: "m" } });
  });
  it("reads feet and inches into metres (0.3048 m per foot, 0.0254 m per inch, NIST SP 811)", () => {
    const r = readLengthEntry("12 ft 6 in", "m");
    expect(r.ok && r.length.unit).toBe("m");
    expect(r.ok && r.length.value).toBeCloseTo(12 * 0.3048 + 6 * 0.0254, 12);
    const q = readLengthEntry(`12' 6"`, "m");
    expect(q.ok && q.length.value).toBeCloseTo(3.81, 12);
    expect(readLengthEntry("320 cm", "ft-in")).toEqual({ ok: true, length: { value: 3.2, unit: "m" } });
  });
  it("refuses zero, commas and words with a reason", () => {
    expect(readLengthEntry("0", "m")).toEqual({ ok: false, message: "must be more than 0" });
    expect(readLengthEntry("1,5 m", "m")).toMatchObject({ ok: false, message: expect.stringMatching(/decimal point/) });
    expect(readLengthEntry("long", "m")).toMatchObject({ ok: false, message: expect.stringMatching(/could not read/) });
    expect(readLengthEntry("", "m")).toMatchObject({ ok: false, message: "is empty" });
    // A door may start at the corner: 0 is allowed where asked for.
    expect(readLengthEntry("0.00 m", "m", { allowZero: true })).toEqual({ ok: true, length: { value: 0, unit: "m" } });
  });
});
