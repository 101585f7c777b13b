import { describe, expect, it } from "vitest";
import { parseLocatorInput, type LocatorInputRaw } from "../contracts/locator-input";
import { locate } from "./locate";
import { LOCATOR_SETTINGS } from "./locator/settings";

// A pinpoint pass fitted with the first pass. The readings come from a model unlike the locator's kernel
// (level along a fan-stirred case in the first pass; an exponential fall-off of 0.4 per metre round the
// leak in still air), so a pass here is not the fit recovering its own model
// (docs/reference/locator-methods.md §5, pitfall 1).

const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];
const CASE = rect(6, 0, 18, 1);

/** The first pass along a 24 m aisle: level at 6–7 ppm along the case whose fans mix the gas, 0.5 ppm away from it. */
function firstPass() {
  return Array.from({ length: 24 }, (_, i) => {
    const x = i + 0.5;
    const ppm = x > 6 && x < 18 ? 6 + ((i * 7) % 3) * 0.5 : x > 5 && x < 19 ? 3 : 0.5;
    return { x, y: 1.2, t: i * 2, ppm };
  });
}

/** Four taps of a short still-air pass ten minutes later, a metre apart round the leak. */
function stillPass(leakX: number) {
  return [-1.5, -0.5, 0.5, 1.5].map((o, k) => {
    const x = leakX + o;
    return { x, y: 1.2, t: 600 + k * 3, ppm: Math.round((1 + 30 * 0.4 ** Math.abs(o)) * 10) / 10, pass: "p2" };
  });
}

function run(readings: LocatorInputRaw["readings"], passes: LocatorInputRaw["passes"] = []) {
  const input = parseLocatorInput({
    plan: { width: 24, height: 4, fixtures: [{ id: "case", kind: "open-case", polygon: CASE, fans: true }] },
    instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
    readings,
    passes,
  });
  return locate(input, { delayFromReadings: false });
}

// the leak at the case's back (0.15 m in from the plan's edge), where a case's piping runs and where a
// spot in a case is drawn (locator/case-back.ts)
const errorOf = (c: { x: number; y: number }, leakX: number) => Math.hypot(c.x - leakX, c.y - 0.15);
const STOPPED = [{ id: "p2", fans: "stopped" as const }];

describe("the joint fit of a first pass and a still-air pass", () => {
  // The first pass is the same whatever the leak (level along the case): its top spot lands near
  // x = 16.4 m every time, so leaks away from there show what the still-air pass adds.
  for (const leakX of [9.3, 11.7, 13.2]) {
    it(`pins a leak at x = ${leakX} m that neither pass pins alone`, () => {
      const first = run(firstPass());
      // the fans mix the gas along the case: the locator says so, and its top spot is not the leak
      expect(first.diagnostics.some((d) => d.kind === "fans-mixing")).toBe(true);
      expect(errorOf(first.candidates[0], leakX)).toBeGreaterThan(3);
      // the first pass's spot that covers the leak is a wide one: "somewhere in this case"
      const covering = first.candidates.filter((c) => errorOf(c, leakX) <= c.radius);
      const firstRadius = Math.min(...covering.map((c) => c.radius), Infinity);

      // four still-air readings alone have no background to stand out from: no credible spot
      const still = run(stillPass(leakX), STOPPED);
      expect(still.candidates).toEqual([]);

      const joint = run([...firstPass(), ...stillPass(leakX)], STOPPED);
      const top = joint.candidates[0];
      expect(errorOf(top, leakX)).toBeLessThan(0.5);
      expect(errorOf(top, leakX)).toBeLessThan(top.radius);
      // tighter than the first pass's wide spot that covers the leak ("somewhere in this case"); the radius
      // follows how far the tempered posterior spreads (posterior-radius.ts), so it is not the floor here
      expect(top.radius).toBeLessThan(firstRadius);
      expect(top.radius).toBeGreaterThanOrEqual(LOCATOR_SETTINGS.placement.minRadiusM);
      // the first pass's readings are still the fans-running evidence they were, and the pass is said to follow
      expect(joint.diagnostics.find((d) => d.kind === "fans-mixing")).toMatchObject({ stilledByPass: true });
      expect(first.diagnostics.find((d) => d.kind === "fans-mixing")).not.toHaveProperty("stilledByPass");
    });
  }

  for (const leakX of [7.2, 15.4, 16.1]) {
    it(`pins a leak at x = ${leakX} m along the case to half a metre, with no spot drawn by the level line first`, () => {
      const joint = run([...firstPass(), ...stillPass(leakX)], STOPPED);
      expect(errorOf(joint.candidates[0], leakX)).toBeLessThan(0.5);
      // the other spots listed are alternatives the still pass leaves open, each a metre and more away
      for (const c of joint.candidates.slice(1)) expect(c.radius).toBeGreaterThan(joint.candidates[0].radius);
    });
  }

  it("reads the mixing only from readings taken while the fixture's fans ran", () => {
    // every reading of the case in a pass with its fans stopped: no fans-mixing, whatever the levels
    const all = firstPass().map((r) => ({ ...r, pass: "p2" }));
    const result = run(all, [{ id: "p2", fans: "stopped", fixture: "case" }]);
    expect(result.diagnostics.some((d) => d.kind === "fans-mixing")).toBe(false);
    expect(run(firstPass()).diagnostics.some((d) => d.kind === "fans-mixing")).toBe(true);
  });

  it("gives the same answer as without passes when no pass changes the air", () => {
    const readings: LocatorInputRaw["readings"] = [...firstPass(), ...stillPass(11.7)];
    const plain = run(readings.map((r) => ({ ...r, pass: undefined })));
    const running = run(readings, [{ id: "p2", fans: "running" }]);
    expect(running).toEqual(plain);
  });

  it("takes an input built in code without the passes field as one pass (the benchmarks build theirs)", () => {
    const input = parseLocatorInput({
      plan: { width: 24, height: 4, fixtures: [{ id: "case", kind: "open-case", polygon: CASE, fans: true }] },
      instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
      readings: firstPass(),
    });
    const { passes: _, ...withoutPasses } = input;
    expect(locate(withoutPasses as typeof input)).toEqual(locate(input));
  });
});
