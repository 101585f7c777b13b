// One store, one policy, from the first alarm on: the technician sweeps leg by leg until a reading
// reaches the alarm, then the policy decides every next reading. After each one we note where the
// leak would be marked and how far that is from the nearest true leak.
import { buildWorld, type World } from "../simulate/scenario";
import { storeStream, type Family } from "../simulate/store-types";
import type { Policy, PolicyStep } from "./policy";

/** The benchmark stops a policy after this many readings from the first alarm. */
export const READING_BUDGET = 40;
/** A mark this close to a true leak is found (the trade's 0.6 m re-check spacing). */
export const FOUND_WITHIN_M = 0.6;

export interface LoopResult {
  family: Family;
  store: number;
  policy: string;
  alarmed: boolean;
  /** Readings and metres from the first alarm until the mark was first within 0.6 m (null: never). */
  readingsToFind: number | null;
  metresToFind: number | null;
  readingsTaken: number;
  /** Distance from the last mark to the nearest true leak (Infinity: nothing marked). */
  finalErrorM: number;
}

/** An alarm farther than this from every leak is not that leak's plume (m). */
const PLUME_REACH_M = 10;

const nearestLeakM = (world: World, p: { x: number; y: number }) =>
  Math.min(...world.truth.leaks.map((l) => Math.hypot(l.x - p.x, l.y - p.y)));

export function runLoop(family: Family, store: number, policy: Policy): LoopResult {
  const world = buildWorld(family, storeStream(family, store));
  const tech = world.technician;
  let from: { readings: number; metres: number } | null = null;
  let readingsToFind: number | null = null;
  let metresToFind: number | null = null;
  let finalErrorM = Number.POSITIVE_INFINITY;
  const taken = () => (from ? tech.readings.length - from.readings : 0);
  const legs = world.layout.legs;
  let leg = 0;
  let fromS = 0;
  while (leg < legs.length && taken() < READING_BUDGET) {
    const alarmAtS = tech.sweepUntilAlarm(world.map, legs[leg], fromS);
    if (alarmAtS === null) {
      leg++;
      fromS = 0;
      continue;
    }
    const tap = tech.readings[tech.readings.length - 1];
    if (!from && nearestLeakM(world, tap) > PLUME_REACH_M) {
      // A blip far from any leak (display noise): both policies would re-check it and walk on alike,
      // so the count starts at the first alarm of a leak's plume.
      fromS = alarmAtS + 0.01;
      continue;
    }
    from ??= { readings: tech.readings.length, metres: tech.walkedM };
    // the truth, for the person reading a trace (the policy never sees it)
    if (process.env.GUIDE_TRACE) console.log(JSON.stringify({ leaks: world.truth.leaks, alarm: tap }));
    const run = policy.run({ world, leg: legs[leg], alarmAtS });
    let outcome: IteratorResult<PolicyStep, "marked" | "nothing">;
    while (!(outcome = run.next()).done) {
      const mark = outcome.value.mark;
      finalErrorM = mark ? nearestLeakM(world, mark) : Number.POSITIVE_INFINITY;
      // Found only within the budget: a sweep between alarms can carry the count past it.
      if (readingsToFind === null && finalErrorM <= FOUND_WITHIN_M && taken() <= READING_BUDGET) {
        readingsToFind = taken();
        metresToFind = tech.walkedM - from.metres;
      }
      if (taken() >= READING_BUDGET) break;
    }
    if (outcome.done && outcome.value === "marked") break;
    // A blip: the sweep goes on just past the stop that alarmed, and no mark of this search stands.
    if (outcome.done) finalErrorM = Number.POSITIVE_INFINITY;
    fromS = alarmAtS + 0.01;
  }
  return {
    family,
    store,
    policy: policy.name,
    alarmed: from !== null,
    readingsToFind,
    metresToFind,
    readingsTaken: taken(),
    finalErrorM,
  };
}
