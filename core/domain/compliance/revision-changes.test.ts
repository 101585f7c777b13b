import { describe, expect, it } from "vitest";
import { revisionChanges, revisionHistory } from "./revision-changes";
import { kgToPounds } from "../units/mass";

const lb = (kg: number) => `${kgToPounds(kg).toFixed(1)} lb`;
// 100 lb = 45.359237 kg and 180 lb = 81.6466266 kg (1 lb = 0.45359237 kg exactly, NIST SP 811).
const first = {
  refrigerantName: "R-22",
  fullChargeKg: 45.359237,
  applianceType: "commercial-refrigeration" as const,
  automaticLeakDetection: false,
  inServiceOn: "2015-04-01",
};

describe("revisionChanges", () => {
  it("lists every fact of the first revision", () => {
    expect(revisionChanges(null, first, lb)).toBe(
      "refrigerant R-22; full charge 100.0 lb; commercial refrigeration; automatic leak detection: no; in service since 1 Apr 2015",
    );
  });

  it("names only what a later revision changed, before and after", () => {
    const retrofit = { ...first, refrigerantName: "R-448A", fullChargeKg: 81.6466266 };
    expect(revisionChanges(first, retrofit, lb)).toBe(
      "refrigerant from R-22 to R-448A; full charge from 100.0 lb to 180.0 lb",
    );
    expect(revisionChanges(retrofit, { ...retrofit, automaticLeakDetection: true }, lb)).toBe(
      "automatic leak detection from no to yes",
    );
    expect(
      revisionChanges(first, { ...first, applianceType: "industrial-process", inServiceOn: "2015-05-01" }, lb),
    ).toBe(
      "appliance type from commercial refrigeration to industrial process refrigeration; in service since 1 May 2015 (was 1 Apr 2015)",
    );
    expect(revisionChanges(first, first, lb)).toBe("no value changed");
  });

  it("compares each revision with the one in force before it", () => {
    const history = revisionHistory(
      [
        first,
        { ...first, fullChargeKg: 81.6466266 },
        { ...first, fullChargeKg: 81.6466266, refrigerantName: "R-407A" },
      ],
      lb,
    );
    expect(history.map((h) => h.changes)).toEqual([
      revisionChanges(null, first, lb),
      "full charge from 100.0 lb to 180.0 lb",
      "refrigerant from R-22 to R-407A",
    ]);
  });
});
