import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { locate } from "../locate";
import { rect } from "../pipeline/stage-fixtures";
import { cutToWindow, evidenceBox } from "./evidence-window";
import { liveFit, liveProbes } from "./live-guide";

// An invented 40 x 12 m store: five 2.4 m cases against the north wall from x = 2, a walk-in in the
// east corner, a line-set drop behind case 3; a technician walks east along y = 2.2, a tap every metre.
const CASES = [0, 1, 2, 3, 4].map((k) => ({
  id: `case-${k + 1}`,
  kind: "open-case" as const,
  polygon: rect(2 + 2.4 * k, 0, 4.4 + 2.4 * k, 1),
  fans: true,
}));
const LEAK = { x: 8.0, y: 0.9 }; // at the front of case 3

function store(blipAt: number | null, alarmPpm = 2) {
  const readings = Array.from({ length: 36 }, (_, i) => {
    const x = 1 + i;
    const y = 2.2;
    // a plume that halves every metre from the leak, over 0.4 ppm of background
    const ppm = Math.round(0.4 + 14 * 0.5 ** Math.hypot(x - LEAK.x, y - LEAK.y));
    return { x, y, t: 2 * i, ppm: blipAt === i ? 3 : ppm };
  });
  return parseLocatorInput({
    plan: {
      width: 40,
      height: 12,
      obstacles: [{ id: "wall", polygon: rect(0, 11.8, 40, 12) }],
      fixtures: [...CASES, { id: "walk-in", kind: "walk-in", polygon: rect(34, 0, 40, 5), fans: true }],
      riskPoints: [{ id: "drop-3", kind: "line-set", x: 7.9, y: 0.5 }],
    },
    instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm },
    readings,
  });
}

describe("the evidence window", () => {
  it("frames the strongest reading's alarms with the margin, and a blip across the store does not stretch it", () => {
    const box = evidenceBox(store(33), 6)!;
    // the plume's alarms (≥ 2 ppm) lie at x = 5..11; 6 m either side, clipped at the plan's edge
    expect(box.x).toBeCloseTo(0, 9);
    expect(box.x + box.width).toBeCloseTo(17, 9);
    expect(box.y).toBe(0);
    expect(box.height).toBeCloseTo(8.2, 9);
  });

  it("is none while no reading reaches the alarm", () => {
    expect(evidenceBox(store(null, 50), 6)).toBeNull();
    expect(liveFit(store(null, 50)).estimate).toEqual({ kind: "no-alarm", readings: 36 });
  });

  it("cuts fixtures to the window and moves everything to its corner, readings in their order", () => {
    const input = store(null);
    const w = cutToWindow(input, { x: 5, y: 0, width: 6, height: 5 });
    // case 2 (4.4–6.8) is cut at x = 5, case 3 (6.8–9.2) whole, case 4 (9.2–11.6) cut at x = 11
    const ids = w.input.plan.fixtures.map((f) => f.id);
    expect(ids).toEqual(["case-2", "case-3", "case-4"]);
    const xs = (id: string) => w.input.plan.fixtures.find((f) => f.id === id)!.polygon.map((p) => p[0]);
    expect(Math.min(...xs("case-2"))).toBeCloseTo(0, 9);
    expect(Math.max(...xs("case-4"))).toBeCloseTo(6, 9);
    expect(w.input.plan.riskPoints.map((p) => p.id)).toEqual(["drop-3"]);
    expect(w.input.plan.riskPoints[0].x).toBeCloseTo(2.9, 9);
    expect(w.kept).toEqual([4, 5, 6, 7, 8, 9, 10]);
    expect(w.input.readings.map((r) => r.x)).toEqual([0, 1, 2, 3, 4, 5, 6]);
  });
});

describe("the live estimate", () => {
  it("before any credible spot, leads to the case where two alarm readings' gas was strongest", () => {
    // Two 3 ppm readings over 0.4 ppm elsewhere, no delay: too weak for a credible spot, enough to
    // say the gas is strongest so far in front of case 4 (x 9.2-11.6), at its back or the drop.
    const base = store(null);
    const readings = base.readings.map((r) => ({ ...r, ppm: r.x === 10 || r.x === 11 ? 3 : 0.4 }));
    const input = parseLocatorInput({ ...base, readings });
    const { estimate } = liveFit(input);
    expect(estimate.kind).toBe("no-spot");
    if (estimate.kind !== "no-spot") return;
    expect(estimate.lead).toBeDefined();
    expect(estimate.lead!.fixtureId).toBe("case-4");
    expect(estimate.lead!.x).toBeGreaterThan(9.2);
    expect(estimate.lead!.x).toBeLessThan(11.6);
  });

  it("puts its first suspect where the full analysis of the whole plan puts it, within its radius", () => {
    // The reference is the same locator on the whole store, as the server runs it after submit.
    const input = store(33);
    const full = locate(input).candidates[0];
    const live = liveFit(input).estimate;
    expect(live.kind).toBe("suspects");
    if (live.kind !== "suspects") return;
    const first = live.suspects[0];
    expect(Math.hypot(first.x - full.x, first.y - full.y)).toBeLessThanOrEqual(full.radius);
    // and near the leak that made the readings
    expect(Math.hypot(first.x - LEAK.x, first.y - LEAK.y)).toBeLessThanOrEqual(first.radius);
  });

  it("suggests up to three places a probe can go, near the first suspect, none inside a case", () => {
    const input = store(null);
    const fit = liveFit(input);
    const probes = liveProbes(fit, { x: 12, y: 2.2 });
    expect(probes.length).toBeGreaterThan(0);
    expect(probes.length).toBeLessThanOrEqual(3);
    for (const p of probes) {
      expect(["case-front", "room-low", "room-high", "line-set"]).toContain(p.kind);
      if (p.kind === "case-front") expect(CASES.some((c) => pointInPolygon([p.x, p.y], c.polygon))).toBe(false);
      expect(Math.hypot(p.x - LEAK.x, p.y - LEAK.y)).toBeLessThanOrEqual(8);
    }
  });

  it("suggests nothing without an alarm", () => {
    expect(liveProbes(liveFit(store(null, 50)), { x: 0, y: 0 })).toEqual([]);
  });

  it("with an alarm but no credible spot yet, traces the gas between where the alarm's air was drawn in and the alarm", () => {
    // One 3 ppm reading at x = 11 over 0.4 ppm elsewhere, 3 s of delay at a tap a metre every 2 s: its
    // air was drawn in about 3 m back along the walk. One reading is not a credible spot.
    const base = store(null);
    const readings = base.readings.map((r) => ({ ...r, ppm: r.x === 11 ? 3 : 0.4 }));
    const input = parseLocatorInput({
      plan: base.plan,
      instrument: { transportDelayS: 3, timeConstantS: 0, alarmPpm: 2 },
      readings,
    });
    const fit = liveFit(input);
    expect(fit.estimate).toMatchObject({ kind: "no-spot" });
    // one reading at the alarm is no lead yet: it may be a wisp
    expect(fit.estimate.kind === "no-spot" && fit.estimate.lead).toBeFalsy();
    const probes = liveProbes(fit, { x: 11, y: 2.2 });
    expect(probes.length).toBeGreaterThan(0);
    for (const p of probes) {
      expect(p.reason.kind).toBe("traces");
      // within the search's reach (3 m) of the stretch from x ≈ 8 to the alarm at x = 11
      expect(p.x).toBeGreaterThan(8 - 3.5);
      expect(p.x).toBeLessThan(11 + 3.5);
      if (p.kind === "case-front") expect(CASES.some((c) => pointInPolygon([p.x, p.y], c.polygon))).toBe(false);
    }
  });
});
