import { describe, expect, it } from "vitest";
import { startWarnings } from "./start-warnings";

const diode = { name: "Diode sniffer", principle: "heated-diode" as const, overdue: false, checkDueOn: "2026-12-20" };
const systems = [
  { id: "a", name: "Rack A", refrigerantId: "R-448A" },
  { id: "b", name: "Booster", refrigerantId: "R-744" },
  { id: "c", name: "Island", refrigerantId: "R-290" },
];

describe("warnings when a sweep starts", () => {
  it("names each hunted refrigerant a heated-diode detector cannot see", () => {
    // Heated-diode sensors respond to halogen compounds; have none (docs/reference/standards.md §6).
    const w = startWarnings(diode, systems);
    expect(w.map((x) => [x.code, x.systemId])).toEqual([
      ["detector-blind", "b"],
      ["detector-blind", "c"],
    ]);
    expect(w[1].message).toMatch(/^Diode sniffer cannot see R-290 on Island/);
  });

  it("says an infrared detector of unknown band may not see a refrigerant, and flags an overdue check", () => {
    const w = startWarnings(
      { ...diode, principle: "infrared", overdue: true, checkDueOn: "2026-10-01" },
      systems.slice(0, 1),
    );
    expect(w.map((x) => x.code)).toEqual(["detector-overdue", "detector-unsure"]);
    expect(w[0].message).toMatch(/due for calibration \/ bump check on 2026-10-01/);
    expect(startWarnings({ ...diode, overdue: true, checkDueOn: null }, [])[0].message).toMatch(
      /no calibration \/ bump check on record/,
    );
  });

  it("stays quiet when the detector sees every hunted refrigerant and is in date", () => {
    expect(startWarnings(diode, systems.slice(0, 1))).toEqual([]);
  });
});
