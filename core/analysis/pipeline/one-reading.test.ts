import { describe, expect, it } from "vitest";
import { locate } from "../locate";
import type { ReadingFields } from "../locator/reading-fields";
import { oneReadingSource } from "./one-reading";
import { aisle, plume, rect } from "./stage-fixtures";

// One reading far above the alarm (2 ppm) with nothing raised around it: too few readings for a fitted
// source (at least two must rise), too strong to call the sweep clean.
const lone = (peak: number, at = 6) => Array.from({ length: 12 }, (_, i) => (i === at ? peak : i % 3 === 0 ? 1 : 0));
const caseAlongNorthWall = { fixtures: [{ id: "case-1", kind: "open-case" as const, polygon: rect(0, 0, 12, 1) }] };

describe("a spot from one reading", () => {
  it("lists one strong lone reading as a spot of its own kind, on the case beside it, with the reach of its air as radius", () => {
    const r = locate(aisle(lone(11), caseAlongNorthWall));
    expect(r.candidates).toHaveLength(1);
    const [c] = r.candidates;
    expect(c.reason.kind).toBe("one-reading");
    expect(c.reason.peakPpm).toBe(11);
    expect(c.radius).toBe(3);
    // the reading was tapped at x = 6.5 m, y = 2 m (no delay); the case is 1-2 m away across the aisle edge
    expect(Math.abs(c.x - 6.5)).toBeLessThanOrEqual(1.5);
    expect(c.y).toBeLessThanOrEqual(1.3);
    // and the sweep is still not called clean: the strong plume's diagnostic stays
    expect(r.diagnostics.some((d) => d.kind === "delay-uncertain")).toBe(true);
  });

  it("lists nothing for a lone reading under four times the alarm", () => {
    // 7 ppm is 3.5 times the alarm: a re-check is the technician's call, not a suspect spot
    expect(locate(aisle(lone(7), caseAlongNorthWall)).candidates).toEqual([]);
  });

  it("takes no reading an active benign-source zone explains, and no cell it cannot see", () => {
    const fields = {
      groupCell: Int32Array.from([0, 0]),
      groupOfReading: Int32Array.from([0, 1]),
      start: Int32Array.from([0, 2, 3]),
      cell: Int32Array.from([5, 6, 7]),
      kernel: Float32Array.from([0.9, 0.1, 0.8]),
    } as unknown as ReadingFields;
    const scan = { delta: Float64Array.from({ length: 8 }, (_, c) => c), q: new Float64Array(8).fill(2) };
    const sources = {
      fields,
      allowed: new Uint8Array(8).fill(1),
      prior: null,
      firstScan: { ...scan, b: new Float64Array(8), chi2Background: 0 },
      residualVariance: 1,
    };
    const lag = { ppm: Float64Array.from([12, 1]), censored: new Uint8Array(2) };
    const rule = { threshold: 0.2, elevatedPpm: 1.5, zoneOfReading: Int32Array.from([-1, -1]) };
    // cell 6 fits better but the reading barely sees it (kernel 0.1 under the threshold 0.2)
    expect(oneReadingSource(lag, { zoneOfReading: Int32Array.from([-1, -1]) }, sources, rule, 0, 8)?.cell).toBe(5);
    expect(oneReadingSource(lag, { zoneOfReading: Int32Array.from([0, -1]) }, sources, rule, 0, 8)).toBeNull();
    expect(oneReadingSource(lag, { zoneOfReading: Int32Array.from([-1, -1]) }, sources, rule, 0, 13)).toBeNull();
  });

  it("lists nothing when other readings the spot's air reaches rise too: that is a weak plume, not one reading", () => {
    // 12 ppm beside 3 ppm: two raised readings, too weak together for a fitted source (Δχ² under 25)
    const ppm = lone(12);
    ppm[8] = 3;
    expect(locate(aisle(ppm, caseAlongNorthWall)).candidates).toEqual([]);
  });

  it("keeps a fitted spot where two readings rise together", () => {
    const r = locate(aisle(plume(6.5, 20), caseAlongNorthWall));
    expect(r.candidates.length).toBeGreaterThan(0);
    expect(r.candidates[0].reason.kind).toBe("fitted");
  });
});
