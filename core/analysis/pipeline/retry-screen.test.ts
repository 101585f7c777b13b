import { describe, expect, it } from "vitest";
import { parseLocatorInput, type LocatorInputRaw } from "../../contracts/locator-input";
import { locate } from "../locate";
import { readingAir } from "../locator/pass-air";
import { casesRunFans, fanStepScale } from "../locator/plan-masks";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { lagStage } from "./lag-stage";
import { passFitOf } from "./pass-fit";
import { NO_PASSES, spotFitsPlume } from "./retry-screen";
import { gridOf, rect } from "./stage-fixtures";
import { zonesStage } from "./zones-stage";

// A 6 m x 4 m walk-in whose fans mixed a leak's gas to a level in the first pass, then a still-air
// pass with its fans stopped, five minutes later, over a 3 x 6 grid of taps. The still-air readings
// fall off 0.35 per metre round the leak: a model unlike the locator's kernel
// (docs/reference/locator-methods.md §5, pitfall 1).
const WALK_IN = rect(2, 1, 8, 5);

function store(leak: [number, number], level: number, peak: number, delayS: number) {
  const readings: LocatorInputRaw["readings"] = [];
  let t = 0;
  for (let x = 0.5; x < 10; x += 1) readings.push({ x, y: 6, t: (t += 2), ppm: 0.5 });
  for (let x = 2.5; x < 8; x += 1)
    for (const y of [1.5, 3, 4.5]) readings.push({ x, y, t: (t += 2), ppm: level + ((x * 7 + y) % 3) * 0.3 });
  t += 300;
  for (let x = 2.5; x < 8; x += 1)
    for (const y of [1.5, 3, 4.5]) {
      const ppm = Math.round((0.5 + peak * 0.35 ** Math.hypot(x - leak[0], y - leak[1])) * 10) / 10;
      readings.push({ x, y, t: (t += 3), ppm, pass: "p2" });
    }
  return parseLocatorInput({
    plan: { width: 10, height: 7, fixtures: [{ id: "wi", kind: "walk-in", polygon: WALK_IN, fans: true }] },
    instrument: { transportDelayS: delayS, timeConstantS: 0, alarmPpm: 2 },
    readings,
    passes: [{ id: "p2", fans: "stopped", fixture: "wi" }],
  });
}

/** The screen's verdict at the stated delay, with the passes as locate() sees them or with none. */
function screen(input: ReturnType<typeof store>, seePasses: boolean) {
  const { plan, instrument } = input;
  const s = LOCATOR_SETTINGS;
  const grid = gridOf(input);
  const stepScale = fanStepScale(grid, plan, s.kernel.fanMixingScale);
  const lag = lagStage(input.readings, instrument, grid, 1);
  const zones = zonesStage(plan.backgroundZones, instrument.alarmPpm, grid, stepScale, lag, {
    zones: s.zones,
    noise: s.noise,
    nearCutoffM: s.kernel.nearCutoffM,
    elevatedPpm: s.sources.elevatedPpm,
  });
  const peak = lag.ppm.indexOf(Math.max(...lag.ppm));
  const air = readingAir(input);
  const models = air.models.slice(1).map((fixtures) => ({
    fansStir: casesRunFans([...fixtures]),
    stepScale: fanStepScale(grid, { ...plan, fixtures: [...fixtures] }, s.kernel.fanMixingScale),
  }));
  // built as locate() builds it (each pass weighed by its own fit, the level where it explains itself)
  const passes = passFitOf(
    plan,
    grid,
    air,
    { models, modelOfReading: air.modelOfReading },
    lag,
    zones,
    instrument.alarmPpm,
    s,
  );
  return spotFitsPlume(plan, grid, stepScale, lag, zones, peak, s, seePasses ? passes : NO_PASSES);
}

/** Whether the full run places a spot with the stated delay itself (not after a retry with another). */
function fullRunFits(input: ReturnType<typeof store>) {
  const r = locate(input, { delayFromReadings: false });
  return r.delay.usedS === input.instrument.transportDelayS && r.candidates.length > 0;
}

describe("the retry screen sees every pass", () => {
  const cases: [leak: [number, number], level: number, peak: number, delayS: number, fits: boolean][] = [
    [[4, 4.5], 8, 20, 3, true],
    [[3, 2], 2.5, 20, 0, true],
    [[5, 3], 4, 20, 0, false],
    [[7, 4], 8, 8, 5, true],
  ];
  for (const [leak, level, peak, delayS, fits] of cases) {
    it(`judges a still-air pass in its own air as the full run does (leak at ${leak}, ${delayS} s)`, () => {
      const input = store(leak, level, peak, delayS);
      expect(fullRunFits(input)).toBe(fits);
      expect(screen(input, true)).toBe(fits);
    });
  }

  it("where a screen of the first pass's air alone would send a full run after a delay that fits nothing", () => {
    // the still-air readings taken as fan-stirred and the level as point evidence: a spot "fits"
    const input = store([5, 3], 4, 20, 0);
    expect(screen(input, false)).toBe(true);
    expect(screen(input, true)).toBe(false);
    expect(fullRunFits(input)).toBe(false);
  });
});
