import { describe, expect, it } from "vitest";
import { getRefrigerant } from "./catalogue";
import { canDetect } from "./detection";

const r = getRefrigerant;

describe("canDetect", () => {
  it("knows heated-diode sensors are blind to R-290, R-600a, R-744 and R-717", () => {
    // docs/reference/standards.md §6 [M]: heated-diode/heated-ceramic sensors respond to halogen compounds and are
    // blind to R-290, R-600a, R-744 and R-717.
    for (const id of ["R-290", "R-600a", "R-744", "R-717"])
      expect(canDetect("heated-diode", r(id)).answer, id).toBe("no");
    for (const id of ["R-22", "R-134a", "R-404A", "R-410A", "R-448A"])
      expect(canDetect("heated-diode", r(id)).answer, id).toBe("yes");
    expect(canDetect("heated-diode", r("R-32")).reason).toMatch(/weakly/);
  });
  it("judges blends by the share of mass the sensor sees", () => {
    // R-455A is 97 % halogenated by mass (ASHRAE 34 [S:G3]): a heated diode sees it; a CO2-band IR sees 3 %.
    expect(canDetect("heated-diode", r("R-455A")).answer).toBe("yes");
    const co2 = canDetect("infrared", r("R-455A"), { band: "CO2" });
    expect(co2.answer).toBe("unknown");
    expect(co2.reason).toMatch(/only R-744, 3%/);
  });
  it("needs the band of an infrared instrument", () => {
    // docs/reference/standards.md §6: NDIR sensors are band-specific [S:D4; bands M].
    expect(canDetect("infrared", r("R-404A")).answer).toBe("unknown");
    expect(canDetect("infrared", r("R-404A"), { band: "C-F" }).answer).toBe("yes");
    expect(canDetect("infrared", r("R-290"), { band: "C-F" }).answer).toBe("no");
    expect(canDetect("infrared", r("R-290"), { band: "C-H" }).answer).toBe("yes");
    expect(canDetect("infrared", r("R-744"), { band: "CO2" }).reason).toMatch(/420 ppm background/);
    expect(canDetect("other", r("R-404A")).answer).toBe("unknown");
  });
});
