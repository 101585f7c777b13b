import { describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import type { LocalReading, LocalSweep } from "./local-types";
import { mixingAdvice } from "./mixing-advice";
import { startPass } from "./pinpoint-pass";

const CASE: Fixture = {
  id: "11111111-1111-4111-8111-111111111111",
  kind: "open-case",
  label: "Dairy 3",
  systemId: null,
  hasFans: true,
  polygon: [
    [1, 2],
    [9, 2],
    [9, 3],
    [1, 3],
  ],
};
const sweep: Pick<LocalSweep, "fans" | "passes"> = { fans: "running", passes: [] };
let seq = 0;
const reading = (x: number, y: number, ppm: number, passId: string | null = null): LocalReading => ({
  id: `r${++seq}`,
  sweepId: "s",
  seq,
  x,
  y,
  takenAt: new Date(Date.UTC(2026, 10, 2, 14, 0, seq)).toISOString(),
  ppm,
  atLeast: false,
  samplePoint: "grille",
  note: "",
  passId,
  sync: { kind: "synced" },
});
/** Taps at the case front (0.2 m off its edge) at these ppm, and four across the aisle at 0.5 ppm. */
const walk = (front: number[]) => [
  ...front.map((ppm, i) => reading(1.5 + i, 3.2, ppm)),
  ...[1, 3, 5, 7].map((x) => reading(x, 6, 0.5)),
];

describe("the advice to stop the fans", () => {
  it("is given when the readings are level and elevated across a case whose fans run", () => {
    // the locator's fans-mixing test: median excess over the alarm, 10–90 % spread under half of it
    const advice = mixingAdvice(sweep, [CASE], walk([6, 6.5, 6, 7, 6.5, 6, 6.5]), 2);
    expect(advice.map((a) => [a.fixture.id, a.count, a.levelPpm])).toEqual([[CASE.id, 7, 6.5]]);
  });

  it("names the case with the highest level first when several read level (the fans spread one leak's gas)", () => {
    // a second case across the aisle (y 8–9), its front at y = 7.8, level at 5 ppm; the first case at 6.5 ppm
    const across: Fixture = {
      ...CASE,
      id: "33333333-3333-4333-8333-333333333333",
      label: "Dairy 9",
      polygon: [
        [1, 8],
        [9, 8],
        [9, 9],
        [1, 9],
      ],
    };
    const readings = [...walk([6, 6.5, 6, 7, 6.5]), ...[5, 5.5, 5, 5, 5.5].map((ppm, i) => reading(1.5 + i, 7.8, ppm))];
    const advice = mixingAdvice(sweep, [across, CASE], readings, 2);
    expect(advice.map((a) => a.fixture.label)).toEqual(["Dairy 3", "Dairy 9"]);
  });

  it("is not given for a plume that points at a spot, for level readings under the alarm, or with the fans stopped", () => {
    expect(mixingAdvice(sweep, [CASE], walk([1, 2, 6, 14, 6, 2, 1]), 2)).toEqual([]);
    expect(mixingAdvice(sweep, [CASE], walk([1.5, 1.5, 1.5, 1.5, 1.5]), 2)).toEqual([]);
    expect(mixingAdvice({ fans: "stopped", passes: [] }, [CASE], walk([6, 6.5, 6, 7, 6.5]), 2)).toEqual([]);
    expect(mixingAdvice(sweep, [{ ...CASE, hasFans: false }], walk([6, 6.5, 6, 7, 6.5]), 2)).toEqual([]);
  });

  it("is not given again for a case a pass has stilled", () => {
    const full = { ...sweep, id: "s" } as LocalSweep;
    const withPass = startPass(full, { condition: "fans-stopped", fixtureId: CASE.id }, "p2", "2026-11-02T14:10:00Z");
    expect(mixingAdvice(withPass, [CASE], walk([6, 6.5, 6, 7, 6.5]), 2)).toEqual([]);
  });
});
