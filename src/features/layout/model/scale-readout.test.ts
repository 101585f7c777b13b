// 1 in = 0.0254 m and 1 ft = 0.3048 m exactly (NIST SP 811, 2008, appendix B.8); the expected
// figures are worked from those by hand.
import { describe, expect, it } from "vitest";
import { pixelScaleText, scaleBarReadout } from "./scale-readout";

describe("a drawing pixel's size in the member's units", () => {
  it("reads in inches or feet to a feet-and-inches member", () => {
    // 0.01524 m = 0.6 in.
    expect(pixelScaleText(0.01524, "ft-in")).toBe("1 px = 0.6 in");
    expect(pixelScaleText(0.02, "ft-in")).toBe("1 px = 0.787 in"); // 0.02 / 0.0254 = 0.78740…
    expect(pixelScaleText(0.4572, "ft-in")).toBe("1 px = 1.5 ft"); // 18 in
  });

  it("reads in centimetres, millimetres or metres to a metric member", () => {
    expect(pixelScaleText(0.02, "m")).toBe("1 px = 2 cm");
    expect(pixelScaleText(0.015238, "m")).toBe("1 px = 1.52 cm");
    expect(pixelScaleText(0.0005, "m")).toBe("1 px = 0.5 mm");
    expect(pixelScaleText(1.25, "m")).toBe("1 px = 1.25 m");
  });

  it("refuses a scale that is not above 0", () => {
    expect(() => pixelScaleText(0, "m")).toThrow("metresPerPixel must be above 0");
  });
});

describe("the scale bar's length", () => {
  it("uses feet, and inches under a foot, to a feet-and-inches member", () => {
    // 1 ft per screen px, 150 px at most: 100 ft.
    expect(scaleBarReadout(0.3048, 150, "ft-in").label).toBe("100 ft");
    // 0.002 m per px × 150 px = 0.3 m = 11.8 in: 10 in, 127 px.
    const inches = scaleBarReadout(0.002, 150, "ft-in");
    expect(inches.label).toBe("10 in");
    expect(inches.pixels).toBeCloseTo(0.254 / 0.002, 9);
  });

  it("uses metres, and centimetres under a metre, to a metric member", () => {
    expect(scaleBarReadout(0.05, 150, "m")).toEqual({ label: "5 m", pixels: 100 });
    const cm = scaleBarReadout(0.002, 150, "m");
    expect(cm.label).toBe("20 cm");
    expect(cm.pixels).toBeCloseTo(100, 9);
  });
});
