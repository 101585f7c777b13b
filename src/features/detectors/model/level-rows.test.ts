import { describe, expect, it } from "vitest";
import { parseRows, toRows } from "./level-rows";

// Invented LED levels; not any instrument's figures.
describe("the level-scale editor's rows", () => {
  it("round-trips bands, a blank top bound meaning open-ended", () => {
    const bands = [
      { level: "1", minPpm: 3, maxPpm: 15 },
      { level: "2", minPpm: 15, maxPpm: null },
    ];
    expect(toRows(bands)).toEqual([
      { level: "1", minPpm: "3", maxPpm: "15" },
      { level: "2", minPpm: "15", maxPpm: "" },
    ]);
    expect(parseRows(toRows(bands))).toEqual({ bands, problems: {} });
  });

  it("names each unreadable field by row before judging the bands together", () => {
    const { problems } = parseRows([
      { level: "", minPpm: "abc", maxPpm: "5" },
      { level: "2", minPpm: "10", maxPpm: "8" },
    ]);
    expect(problems).toEqual({
      "0.level": "is required",
      "0.minPpm": "must be a number of ppm, 0 or more",
      "1.maxPpm": "must be above the lower bound",
    });
  });

  it("reports an overlap as the server would", () => {
    const { problems } = parseRows([
      { level: "1", minPpm: "3", maxPpm: "15" },
      { level: "2", minPpm: "12", maxPpm: "" },
    ]);
    expect(problems["1.minPpm"]).toMatch(/must not overlap level 1/);
  });
});
