import { describe, expect, it } from "vitest";
import { levelScaleProblems } from "./level-scale";

// Invented three-level scale of an LED sniffer; the bands are examples, not a product's figures.
const sound = [
  { level: "Low", minPpm: 3, maxPpm: 15 },
  { level: "Mid", minPpm: 15, maxPpm: 60 },
  { level: "High", minPpm: 60, maxPpm: null },
];

describe("a detector's level scale", () => {
  it("accepts ascending bands that touch, with an open-ended top level", () => {
    expect(levelScaleProblems(sound)).toEqual({});
    expect(levelScaleProblems([])).toEqual({});
  });

  it("names an overlap by the band that starts too low", () => {
    expect(levelScaleProblems([sound[0], { ...sound[1], minPpm: 10 }, sound[2]])).toEqual({
      "1.minPpm": expect.stringMatching(/must not overlap level 1 \(up to 15 ppm\)/),
    });
  });

  it("refuses levels listed from high to low", () => {
    expect(levelScaleProblems([sound[1], sound[0]])).toEqual({ "1.minPpm": expect.stringMatching(/low to high/) });
  });

  it("allows only the top level to be open-ended", () => {
    expect(levelScaleProblems([{ ...sound[0], maxPpm: null }, sound[1]])).toEqual({
      "0.maxPpm": expect.stringMatching(/only the top level/),
    });
  });

  it("refuses a repeated level name, whatever its case", () => {
    expect(levelScaleProblems([sound[0], { ...sound[1], level: "low" }])).toEqual({
      "1.level": "must differ from level 1's name",
    });
  });
});
