import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { rect } from "../pipeline/stage-fixtures";
import { searchAroundAlarm } from "./evidence-search";
import { driftChoiceFor } from "./drift-kernels";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { createSourceKernel } from "../locator/source-kernel";
import { driftedKernel } from "../locator/local-drift";

// A 30 m lineup of three cases with their fans running against the north wall (y 0..1) of a 30 x 6 m
// aisle; the probe reads their fronts at y = 1.15. Worked cases made with the locator's own kernels.
const plan = parseLocatorInput({
  plan: {
    width: 30,
    height: 6,
    obstacles: [],
    fixtures: [0, 10, 20].map((x, i) => ({
      id: `case-${i + 1}`,
      kind: "open-case",
      polygon: rect(x, 0, x + 10, 1),
      fans: true,
    })),
    riskPoints: [],
  },
  instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
  readings: [{ x: 1, y: 2, t: 0, ppm: 0 }],
}).plan;
const k = LOCATOR_SETTINGS.kernel;
const plain = createSourceKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM);
const kernel = (d: number) => plain.at(d);
const search = (evidence: { x: number; y: number; ppm: number }[], alarmX: number, upwind?: boolean) =>
  searchAroundAlarm({
    plan,
    origin: { x: alarmX, y: 1.15 },
    alarm: { x: alarmX, y: 1.15 },
    evidence,
    read: evidence,
    from: { x: alarmX, y: 1.15 },
    kernel,
    drift: driftChoiceFor(plan),
    n: 8,
    ...(upwind === undefined ? {} : { upwind }),
  });

describe("searchAroundAlarm follows the readings' rise (decision 0162)", () => {
  it("moves on to a stronger reading beyond the strongest one's reach", () => {
    // the alarm at x = 3 (2 ppm), 3 ppm at x = 5, 8 ppm at x = 10.5: 7.5 m from the alarm, beyond the
    // readings that weigh its sites, 5.5 m from the 3 ppm
    const evidence = [
      { x: 1, y: 1.15, ppm: 0 },
      { x: 3, y: 1.15, ppm: 2 },
      { x: 5, y: 1.15, ppm: 3 },
      { x: 10.5, y: 1.15, ppm: 8 },
    ];
    const { mark } = search(evidence, 3, false);
    expect(mark).not.toBeNull();
    // without the move on, no site lies past x = 8 (3 m beyond the 3 ppm reading)
    expect(mark!.x).toBeGreaterThan(8.1);
  });

  it("reaches on past the strongest reading the way the readings rose from the alarm", () => {
    // A leak at x = 16 whose gas the drift carries west along the fronts: read from x = 9 to 14.
    const leak = { x: 16, y: 0.15 };
    const carried = driftedKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM, [-1, 0]);
    const at = (x: number) => carried(Math.hypot(x - leak.x, 1.15 - leak.y), x - leak.x, 1.15 - leak.y);
    // 12 ppm over the background at the strongest reading, x = 14
    const evidence = Array.from({ length: 11 }, (_, i) => 9 + 0.5 * i).map((x) => ({
      x,
      y: 1.15,
      ppm: Math.round(0.4 + (12 * at(x)) / at(14)),
    }));
    // the strongest reading is the last, at x = 14: without reaching on, no probe lies past 3 m beyond it
    const beyond = (s: ReturnType<typeof search>) => s.probes.filter((p) => p.x > 14 + 3.3).length;
    expect(beyond(search(evidence, 9, false))).toBe(0);
    const upwind = search(evidence, 9, true);
    expect(beyond(upwind)).toBeGreaterThan(0);
  });
});
