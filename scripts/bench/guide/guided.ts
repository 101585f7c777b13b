// Plumeline's way after an alarm: run the locator on the readings so far, mark its first suspect, and
// take the next reading where it best tells the current hypotheses apart (core/analysis/guide). While
// the locator finds no credible spot near the alarm, the readings around where the alarm's air was
// drawn in are weighed site by site (evidence-search.ts): the likeliest site is a provisional mark and
// the next reading brackets the gas's peak along the case. Stop when the mark has settled: it moved
// less than SETTLED_M over the last SETTLED_READINGS. If no probe reaches the alarm after
// ORIGIN_PROBES readings, the alarm counts as a passing wisp and the sweep goes on.
import { evidenceOf, searchAroundAlarm } from "#core/analysis/guide/evidence-search";
import { hypothesesOf, nextProbes } from "#core/analysis/guide/next-probes";
import { probePlaces } from "#core/analysis/guide/probe-places";
import { locate } from "#core/analysis/locate";
import { createSourceKernel } from "#core/analysis/locator/source-kernel";
import { LOCATOR_SETTINGS } from "#core/analysis/locator/settings";
import { parseLocatorInput } from "#core/contracts/locator-input";
import type { Policy } from "./policy";
import { holdS } from "./trade-rule";

const SETTLED_M = 0.3;
const SETTLED_READINGS = 3;
/** A provisional mark (no credible spot yet) settles only once it holds this share of the sites' weight. */
const SETTLED_SHARE = Number(process.env.GUIDE_SHARE ?? 0.6);
/** Probe places are looked for this far around the first suspect (m). */
const REACH_M = 6;
/** The live suspects are those within this distance of the alarm that started the search (m). */
const WINDOW_M = 8;
/** Probes around the alarm's origin that never reach the alarm before it counts as a wisp. */
const ORIGIN_PROBES = 4;

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
    const alarmPpm = world.instrument.alarmPpm;
    /** The places this search has probed (the technician knows where they held the probe). */
    const visited: { x: number; y: number }[] = [];
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
      const here = { x, y };
      const probes = readings.slice(alarmIndex + 1);
      let mark: { x: number; y: number } | null;
      /** How much of the weight the provisional mark holds (1 for the locator's credible spot). */
      let provisionalShare = 1;
      let next: { x: number; y: number } | undefined;
      if (first && process.env.GUIDE_MARK !== "evidence") {
        mark = { x: first.x, y: first.y };
        const places = probePlaces(input.plan, first, REACH_M);
        next = nextProbes(hypothesesOf(near, result.readings, kernel), places, kernel, here)[0];
      } else {
        // No credible spot yet: weigh the places around where the alarm's air came from.
        const origin = result.readings[alarmIndex].corrected;
        // Each reading at the place its air came from: a held probe read the air where it stood.
        const evidence = evidenceOf(result.readings, input.instrument);
        if (probes.length >= ORIGIN_PROBES && !probes.some((r) => r.ppm >= alarmPpm)) return "nothing";
        const search = searchAroundAlarm({
          plan: input.plan,
          origin,
          alarm,
          evidence,
          read: visited,
          from: here,
          kernel,
        });
        // Marked once a re-check has reached the alarm, as the trade rule marks only a peak at the alarm.
        const confirmed = probes.some((r) => r.ppm >= alarmPpm);
        mark = confirmed && search.mark ? { x: search.mark.x, y: search.mark.y } : null;
        provisionalShare = search.mark?.share ?? 0;
        next = search.probes[0];
        if (!next && probes.length === 0) return "nothing";
      }
      if (mark) marks.push(mark);
      const last = marks[marks.length - 1];
      const settled =
        mark !== null &&
        provisionalShare >= SETTLED_SHARE &&
        marks.length >= SETTLED_READINGS + 1 &&
        marks.slice(-SETTLED_READINGS - 1).every((m) => Math.hypot(m.x - last.x, m.y - last.y) <= SETTLED_M);
      if (process.env.GUIDE_DEBUG)
        console.log(
          JSON.stringify({
            mode: first ? "credible" : "evidence",
            at: here,
            last: readings[readings.length - 1],
            origin: result.readings[alarmIndex].corrected,
            mark,
            next,
          }),
        );
      yield { mark };
      if (settled) return "marked";
      if (!next) return mark ? "marked" : "nothing";
      // held as long as the trade rule's re-checks, so a reading is of the air where it was taken
      visited.push(next);
      world.technician.probeAt(world.map, [next.x, next.y], hold);
    }
  },
};
