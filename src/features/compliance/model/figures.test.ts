import { describe, expect, it } from "vitest";
import type { DueItem } from "#core/contracts/compliance";
import { arrangeDue, daysInWords, formatMass } from "./figures";

const item = (over: Partial<DueItem>): DueItem => ({
  kind: "repair",
  what: "x",
  dueOn: "2026-05-01",
  state: "upcoming",
  daysLeft: 3,
  source: "s",
  storeId: "a",
  storeName: "A",
  systemId: null,
  systemName: null,
  findingId: null,
  detectorId: null,
  link: "/",
  ...over,
});

describe("Today figures", () => {
  it("shows kg as lb with the exact factor (NIST SP 811: 1 lb = 0.45359237 kg)", () => {
    expect(formatMass(0.45359237 * 150, "lb")).toBe("150.0 lb");
    expect(formatMass(68.0388555, "kg")).toBe("68.04 kg");
  });

  it("filters by store and sorts by due date, store or kind, undated first", () => {
    const list = [
      item({ what: "b", dueOn: "2026-05-03", storeId: "b", storeName: "B" }),
      item({ what: "n", dueOn: null, kind: "detector-check", storeId: null, storeName: null }),
      item({ what: "a", kind: "inspection" }),
    ];
    expect(arrangeDue(list, null, "due").map((i) => i.what)).toEqual(["n", "a", "b"]);
    expect(arrangeDue(list, "b", "due").map((i) => i.what)).toEqual(["b"]);
    expect(arrangeDue(list, null, "kind").map((i) => i.what)).toEqual(["n", "a", "b"]);
    expect(daysInWords(-2)).toBe("2 days late");
    expect(daysInWords(1)).toBe("in 1 day");
  });
});
