import { describe, expect, it } from "vitest";
import type { LocalReading } from "./local-types";
import { supplyCheckOf } from "./supply-check";

const suspect = { rank: 1, x: 10, y: 1, radius: 2.5, score: 1, fixtureId: "c3", riskPointId: null };
const reading = (x: number, samplePoint: LocalReading["samplePoint"], ppm = 4): LocalReading => ({
  id: `r${x}${samplePoint}`,
  sweepId: "s",
  seq: 1,
  x,
  y: 1,
  takenAt: "2026-03-02T13:10:00.000Z",
  ppm,
  atLeast: false,
  samplePoint,
  note: "",
  sync: { kind: "queued-new" },
});

describe("the supply-air check of a settled suspect", () => {
  it("is not asked for while no suspect has settled", () => {
    expect(supplyCheckOf(null, [reading(10, "supply")])).toEqual({ kind: "none" });
  });

  it("is asked for until a supply-air reading lies within the suspect's radius", () => {
    expect(supplyCheckOf(suspect, [reading(10, "grille"), reading(14, "supply")]).kind).toBe("ask");
    const done = supplyCheckOf(suspect, [reading(10, "grille"), reading(11, "supply", 9)]);
    expect(done.kind === "read" && done.reading.ppm).toBe(9);
  });
});
