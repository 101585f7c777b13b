// Plumeline's way after an alarm (decision 0077): after each reading, run the locator on the readings so
// far and weigh the places a leak could be around the alarm (core/analysis/guide/evidence-search.ts:
// case backs, risk points and rooms between where the alarm's air was drawn in and the alarm, around
// the strongest reading so far, and around the locator's first suspect once that is credible). The
// likeliest place is the mark, once a re-check has reached the alarm; the next reading goes where it
// best tells the likely places apart, held as long as the trade rule's re-checks. Stop when the mark
// has settled: it moved less than SETTLED_M over the last SETTLED_READINGS and holds SETTLED_SHARE of
// the weight. If ORIGIN_PROBES probes never reach the alarm, it was a passing wisp and the sweep goes on.
import { evidenceOf, searchAroundAlarm } from "#core/analysis/guide/evidence-search";
import { locate } from "#core/analysis/locate";
import { createSourceKernel } from "#core/analysis/locator/source-kernel";
import { LOCATOR_SETTINGS } from "#core/analysis/locator/settings";
import { parseLocatorInput } from "#core/contracts/locator-input";
import type { Policy } from "./policy";
import { holdS } from "./trade-rule";

const SETTLED_M = 0.3;
const SETTLED_READINGS = 3;
/** The mark settles only once it holds this share of the sites' weight (tuned on stores 6001-6003). */
const SETTLED_SHARE = 0.3;
/** The locator's suspects are those within this distance of the alarm that started the search (m). */
const WINDOW_M = 8;
/** Probes around the alarm that never reach the alarm before it counts as a wisp. */
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
      // The locator's evidence around this alarm, not a spot elsewhere in the store passed earlier.
      const first = result.candidates.find((c) => Math.hypot(c.x - alarm.x, c.y - alarm.y) <= WINDOW_M);
      const [x, y] = world.technician.position;
      const probes = readings.slice(alarmIndex + 1);
      if (probes.length >= ORIGIN_PROBES && !probes.some((r) => r.ppm >= alarmPpm)) return "nothing";
      const search = searchAroundAlarm({
        plan: input.plan,
        origin: result.readings[alarmIndex].corrected,
        alarm,
        // each reading at the place its air came from: a held probe read the air where it stood
        evidence: evidenceOf(result.readings, input.instrument),
        read: visited,
        from: { x, y },
        kernel,
        also: first ? [{ x: first.x, y: first.y, reach: first.radius / 2 }] : [],
      });
      // Marked once a re-check has reached the alarm, as the trade rule marks only a peak at the alarm.
      const confirmed = probes.some((r) => r.ppm >= alarmPpm);
      const mark = confirmed && search.mark ? { x: search.mark.x, y: search.mark.y } : null;
      const next = search.probes[0];
      if (mark) marks.push(mark);
      const settled =
        mark !== null &&
        (search.mark?.share ?? 0) >= SETTLED_SHARE &&
        marks.length >= SETTLED_READINGS + 1 &&
        marks.slice(-SETTLED_READINGS - 1).every((m) => Math.hypot(m.x - mark.x, m.y - mark.y) <= SETTLED_M);
      if (process.env.GUIDE_TRACE)
        console.log(JSON.stringify({ credible: !!first, last: readings.at(-1), mark, next }));
      yield { mark };
      if (settled) return "marked";
      if (!next) return mark ? "marked" : "nothing";
      visited.push(next);
      world.technician.probeAt(world.map, [next.x, next.y], hold);
    }
  },
};
