import { describe, expect, it } from "vitest";
import { formatRecordMass } from "./format-units";

describe("formatRecordMass (both units, the company's first)", () => {
  // 1 lb = 0.45359237 kg exactly (NIST SP 811, appendix B): 10 lb = 4.5359237 kg, 1,500 lb = 680.388555 kg.
  it("writes the company's unit first and the other in brackets, in its number format", () => {
    expect(formatRecordMass(4.5359237, "kg")).toBe("4.54 kg (10.0 lb)");
    expect(formatRecordMass(680.388555, "lb")).toBe("1,500.0 lb (680.39 kg)");
    expect(formatRecordMass(680.388555, "lb", "1.234,5")).toBe("1.500,0 lb (680,39 kg)");
    expect(formatRecordMass(680.388555, "kg", "1 234,5")).toBe("680,39 kg (1\u202f500,0 lb)");
  });
});
