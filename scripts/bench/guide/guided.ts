// Plumeline's way after an alarm: run the locator on the readings so far, mark its first suspect, and
// take the next reading where it best tells the current hypotheses apart (core/analysis/guide). Stop
// when the first suspect has settled: it moved less than SETTLED_M over the last SETTLED_READINGS.
import { nextProbes, hypothesesOf } from "#core/analysis/guide/next-probes";
import { probePlaces } from "#core/analysis/guide/probe-places";
import { locate } from "#core/analysis/locate";
import { createSourceKernel } from "#core/analysis/locator/source-kernel";
import { LOCATOR_SETTINGS } from "#core/analysis/locator/settings";
import { parseLocatorInput } from "#core/contracts/locator-input";
import type { Policy } from "./policy";

const SETTLED_M = 0.3;
const SETTLED_READINGS = 3;
/** Probe places are looked for this far around the first suspect (m). */
const REACH_M = 6;
/** The live suspects are those within this distance of the alarm that started the search (m). */
const WINDOW_M = 8;

export const guided: Policy = {
  name: "guided",
  *run({ world }) {
    const k = LOCATOR_SETTINGS.kernel;
    const source = createSourceKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM);
    const kernel = (d: number) => source.at(d);
    const marks: { x: number; y: number }[] = [];
    const readings = world.technician.readings;
    const alarm = readings[readings.length - 1];
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
      // No credible spot from the readings so far: the alarm was a blip, and the sweep goes on.
      if (!first) return "nothing";
      marks.push({ x: first.x, y: first.y });
      const settled =
        marks.length >= SETTLED_READINGS + 1 &&
        marks.slice(-SETTLED_READINGS - 1).every((m) => Math.hypot(m.x - first!.x, m.y - first!.y) <= SETTLED_M);
      yield { mark: marks[marks.length - 1] };
      if (settled) return "marked";
      const [x, y] = world.technician.position;
      const places = probePlaces(input.plan, first, REACH_M);
      const next = nextProbes(hypothesesOf(near, result.readings, kernel), places, kernel, { x, y })[0];
      if (!next) return "marked";
      world.technician.probeAt(world.map, [next.x, next.y]);
    }
  },
};
