// Is the live window the same guidance as the full analysis? `npx tsx scripts/bench/guide-fits.ts
// [--first K] [--stores N] [--families a,b]`: the guided policy runs on the full analysis after every
// reading, and at each of its looks the live window (fits.ts) is asked the same question on the same
// readings. Printed: how often the two send the next probe to the same place, how far apart their
// marks are, whether both or neither have a mark, and the time each took.
import { performance } from "node:perf_hooks";
import { runLoop } from "./guide/closed-loop";
import { fullFit, windowFit, type Fitter } from "./guide/fits";
import { guidedView, guidedWith } from "./guide/guided";
import type { Family } from "./simulate/store-types";

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && args[k + 1] ? args[k + 1] : fallback;
};
const first = Number(option("--first", "6001"));
const stores = Number(option("--stores", "3"));
const families = option("--families", "single-fans,two-leaks,walkin-fans").split(",") as Family[];

const timed =
  (fitter: Fitter, spent: number[]): Fitter =>
  (input) => {
    const t0 = performance.now();
    const fit = fitter(input);
    spent.push(performance.now() - t0);
    return fit;
  };
const fullMs: number[] = [];
const windowMs: number[] = [];
const full = timed(fullFit, fullMs);
const windowed = timed(windowFit, windowMs);

let looks = 0;
let sameNext = 0;
let sameMarkState = 0;
const markGapsM: number[] = [];
const nextGapsM: number[] = [];
const policy = guidedWith(full, ({ world, alarmIndex, visited, view }) => {
  const other = guidedView(world, alarmIndex, visited, windowed);
  looks++;
  if (view.next && other.next) nextGapsM.push(Math.hypot(view.next.x - other.next.x, view.next.y - other.next.y));
  if ((!view.next && !other.next) || (view.next && other.next && nextGapsM.at(-1) === 0)) sameNext++;
  if (!!view.mark === !!other.mark) sameMarkState++;
  if (view.mark && other.mark) markGapsM.push(Math.hypot(view.mark.x - other.mark.x, view.mark.y - other.mark.y));
});

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor((s.length - 1) / 2)] : Number.NaN;
};
const pct = (a: number, b: number) => `${a} of ${b} (${((100 * a) / Math.max(b, 1)).toFixed(0)} %)`;
for (const family of families)
  for (let n = first; n < first + stores; n++) {
    const r = runLoop(family, n, policy);
    console.log(`${family}-${n}: ${r.readingsTaken} readings, final ${r.finalErrorM.toFixed(2)} m`);
  }
console.log(`looks: ${looks}`);
console.log(`same next probe place: ${pct(sameNext, looks)}`);
console.log(`next probes within 0.6 m: ${pct(nextGapsM.filter((d) => d <= 0.6).length, nextGapsM.length)}`);
console.log(`both or neither marked: ${pct(sameMarkState, looks)}`);
console.log(
  `marks within 0.3 m: ${pct(markGapsM.filter((d) => d <= 0.3).length, markGapsM.length)}, within 0.6 m: ${pct(markGapsM.filter((d) => d <= 0.6).length, markGapsM.length)}, largest ${Math.max(0, ...markGapsM).toFixed(2)} m`,
);
console.log(
  `locator time per look: full median ${median(fullMs).toFixed(0)} ms, window median ${median(windowMs).toFixed(0)} ms (${fullMs.length} and ${windowMs.length} runs)`,
);
