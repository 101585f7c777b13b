// Numbering copies so each case on a plan has a label of its own: the convention of numbering
// items in a row from 1 is common practice, no published source.
import { describe, expect, it } from "vitest";
import { LABEL_MAX } from "#core/contracts/fixtures";
import { copyLabels } from "./copy-labels";

describe("labels of copies", () => {
  it("numbers copies of a label without a number, the original counting as 1", () => {
    expect(copyLabels(["Freezer"], 3, ["Freezer"])).toEqual([["Freezer 2", "Freezer 3", "Freezer 4"]]);
  });

  it("counts on from a trailing number and keeps its zero padding", () => {
    expect(copyLabels(["Case 4"], 2, ["Case 4"])).toEqual([["Case 5", "Case 6"]]);
    expect(copyLabels(["C09"], 2, ["C09"])).toEqual([["C10", "C11"]]);
    expect(copyLabels(["Door 007"], 1, [])).toEqual([["Door 008"]]);
  });

  it("skips numbers already on the plan, whatever their case or outer spaces", () => {
    expect(copyLabels(["Case 4"], 2, ["Case 4", "Case 5", " case 7 "])).toEqual([["Case 6", "Case 8"]]);
    expect(copyLabels(["Freezer"], 2, ["Freezer", "FREEZER 2"])).toEqual([["Freezer 3", "Freezer 4"]]);
  });

  it("gives two sources of one label different numbers", () => {
    expect(copyLabels(["Dairy", "Dairy"], 1, ["Dairy", "Dairy"])).toEqual([["Dairy 2"], ["Dairy 3"]]);
    expect(copyLabels(["Dairy 1", "Deli 1"], 2, [])).toEqual([
      ["Dairy 2", "Dairy 3"],
      ["Deli 2", "Deli 3"],
    ]);
  });

  it("puts the number straight after a label ending in a separator", () => {
    expect(copyLabels(["Bay #"], 1, [])).toEqual([["Bay #2"]]);
    expect(copyLabels(["Case-"], 1, [])).toEqual([["Case-2"]]);
    expect(copyLabels(["Aisle (A)"], 1, [])).toEqual([["Aisle (A) 2"]]);
  });

  it("leaves an empty label empty", () => {
    expect(copyLabels(["", "  "], 2, [])).toEqual([
      ["", ""],
      ["  ", "  "],
    ]);
  });

  it("numbers past the largest safe integer exactly", () => {
    expect(copyLabels(["Tag 9007199254740993"], 1, [])).toEqual([["Tag 9007199254740994"]]);
  });

  it("keeps a long label within the limit by shortening its stem, never its number", () => {
    const long = "W".repeat(LABEL_MAX);
    const [[a, b]] = copyLabels([long], 2, [long]);
    expect(a).toHaveLength(LABEL_MAX);
    expect(a.endsWith(" 2")).toBe(true);
    expect(b.endsWith(" 3")).toBe(true);
    expect(a).not.toBe(b);
  });

  it("refuses a count that is not a whole number", () => {
    expect(() => copyLabels(["A"], 1.5, [])).toThrow("copies must be a whole number");
    expect(() => copyLabels(["A"], -1, [])).toThrow("copies must be a whole number");
  });
});
