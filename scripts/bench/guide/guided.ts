// Plumeline's way after an alarm: run the locator on the readings so far, mark its first suspect, and
// take the next reading where it best tells the current hypotheses apart (core/analysis/guide). Stop
// when the first suspect has settled: it moved less than SETTLED_M over the last SETTLED_READINGS.
// While the readings support no suspect yet, the next reading goes where the alarm's air was drawn in
// (probesAroundAlarm), at most ORIGIN_PROBES times before the alarm counts as a passing wisp.
import { hypothesesOf, nextProbes, probesAroundAlarm } from "#core/analysis/guide/next-probes";
import { probePlaces } from "#core/analysis/guide/probe-places";
import { locate } from "#core/analysis/locate";
import { createSourceKernel } from "#core/analysis/locator/source-kernel";
import { LOCATOR_SETTINGS } from "#core/analysis/locator/settings";
import { parseLocatorInput } from "#core/contracts/locator-input";
import type { Policy } from "./policy";
import { holdS } from "./trade-rule";

const SETTLED_M = 0.3;
const SETTLED_READINGS = 3;
/** Probe places are looked for this far around the first suspect (m). */
const REACH_M = 6;
/** The live suspects are those within this distance of the alarm that started the search (m). */
const WINDOW_M = 8;
/** Readings taken around the alarm's origin while no suspect is supported, before giving up on it. */
const ORIGIN_PROBES = 4;
/** Probe places around the alarm's origin are looked for this far from it (m). */
const ORIGIN_REACH_M = 3;

export const guided: Policy = {
  name: "guided",
  *run({ world }) {
    const k = LOCATOR_SETTINGS.kernel;
    const source = createSourceKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM);
    const kernel = (d: number) => source.at(d);
    const marks: { x: number; y: number }[] = [];
    const readings = world.technician.readings;
    const alarmIndex = readings.length - 1;
    const alarm = readings[alarmIndex];
    const hold = holdS(world);
    let originProbes = 0;
    for (;;) {
      const input = parseLocatorInput({
        plan: world.plan,
        instrument: world.instrument,
        readings: world.technician.readings,
      });
      const result = locate(input);
      // The evidence around this alarm, not a spot elsewhere in the store the sweep passed earlier.
      const near = result.candidates.filter((c) => Math.hypot(c.x - alarm.x, c.y - alarm.y) <= WINDOW_M);
      const first = near[0];
      const [x, y] = world.technician.position;
      if (!first) {
        // No credible spot from the readings so far: look where the alarm's air came from, then walk on.
        if (originProbes >= ORIGIN_PROBES) return "nothing";
        const origin = result.readings[alarmIndex].corrected;
        const taken = readings.slice(alarmIndex);
        const next = probesAroundAlarm(origin, probePlaces(input.plan, origin, ORIGIN_REACH_M), taken)[0];
        if (!next) return "nothing";
        originProbes++;
        world.technician.probeAt(world.map, [next.x, next.y], hold);
        yield { mark: null };
        continue;
      }
      marks.push({ x: first.x, y: first.y });
      const settled =
        marks.length >= SETTLED_READINGS + 1 &&
        marks.slice(-SETTLED_READINGS - 1).every((m) => Math.hypot(m.x - first!.x, m.y - first!.y) <= SETTLED_M);
      yield { mark: marks[marks.length - 1] };
      if (settled) return "marked";
      const places = probePlaces(input.plan, first, REACH_M);
      const next = nextProbes(hypothesesOf(near, result.readings, kernel), places, kernel, { x, y })[0];
      if (!next) return "marked";
      // held as long as the trade rule's re-checks, so a reading is of the air where it was taken
      world.technician.probeAt(world.map, [next.x, next.y], hold);
    }
  },
};
