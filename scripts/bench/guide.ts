// `npm run bench:guide [-- --stores N] [--first K] [--families a,b] [--policies trade,guided] [--out F.json]`: the closed loop of docs/benchmarks.md
// ("Live guidance"). A simulated technician sweeps until the first alarm, then either follows the
// trade's rule or Plumeline's next-probe suggestions; we count readings and metres until the marked
// spot is within 0.6 m of a leak, the share that get there within 40 readings, and the final error.
// Stores are generated fresh from numbers no other benchmark set uses (5001 on by default).
import { readFileSync, writeFileSync } from "node:fs";
import { runLoop, READING_BUDGET, type LoopResult } from "./guide/closed-loop";
import type { Policy } from "./guide/policy";
import { guided } from "./guide/guided";
import { tradeRule } from "./guide/trade-rule";
import type { Family } from "./simulate/store-types";

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && args[k + 1] ? args[k + 1] : fallback;
};
const perFamily = Number(option("--stores", "30"));
const first = Number(option("--first", "5001"));
const families = option("--families", "single-fans,single-still,two-leaks,walkin-fans").split(",") as Family[];
const policies: Policy[] = option("--policies", "trade,guided")
  .split(",")
  .map((name) => (name === "trade" ? tradeRule : name === "guided" ? guided : null))
  .filter((p): p is Policy => {
    if (!p) throw new Error("--policies: name trade and/or guided");
    return true;
  });
/** Every store's result as JSON, so runs of one policy at a time can be put side by side (--merge). */
const out = option("--out", "");
/** Summarise saved results instead of running: --merge a.json,b.json */
const merge = option("--merge", "");

/**
 * The median of counts where a run that never got within 0.6 m counts as more than the budget
 * (Infinity): the middle value of the sorted list (for an even count, the mean of the two middle ones),
 * so it is finite only when more than half the runs got there.
 */
const median = (xs: number[]) => {
  if (xs.length === 0) return Number.NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const fmt = (v: number, digits = 1) => (Number.isFinite(v) ? v.toFixed(digits) : `> ${READING_BUDGET}`);
const fmtM = (v: number, digits = 1) => (Number.isFinite(v) ? v.toFixed(digits) : "never");
const fmtError = (v: number) => (Number.isFinite(v) ? v.toFixed(2) : "no mark");

function summarise(rows: LoopResult[]) {
  const alarmed = rows.filter((r) => r.alarmed);
  const found = alarmed.filter((r) => r.readingsToFind !== null);
  // A store never found counts as more readings than the budget, so the median stays honest.
  const readings = alarmed.map((r) => r.readingsToFind ?? Number.POSITIVE_INFINITY);
  return {
    stores: rows.length,
    alarmed: alarmed.length,
    found: found.length,
    medianReadings: median(readings),
    medianMetres: median(alarmed.map((r) => r.metresToFind ?? Number.POSITIVE_INFINITY)),
    medianFinalError: median(alarmed.map((r) => r.finalErrorM)),
    within15: alarmed.filter((r) => r.finalErrorM <= 1.5).length,
    medianTaken: median(alarmed.map((r) => r.readingsTaken)),
  };
}

/**
 * Store by store, guided against the trade rule on the same store (never found counts as more than
 * the budget): how often guided got within 0.6 m in fewer readings, in as many, or in more.
 */
function paired(rows: LoopResult[]) {
  const byStore = new Map<number, { trade?: LoopResult; guided?: LoopResult }>();
  for (const r of rows) {
    const pair = byStore.get(r.store) ?? {};
    if (r.policy === tradeRule.name) pair.trade = r;
    if (r.policy === guided.name) pair.guided = r;
    byStore.set(r.store, pair);
  }
  const count = (r: LoopResult) => r.readingsToFind ?? Number.POSITIVE_INFINITY;
  let fewer = 0;
  let same = 0;
  let more = 0;
  let closer = 0;
  let farther = 0;
  for (const { trade, guided: g } of byStore.values()) {
    if (!trade?.alarmed || !g?.alarmed) continue;
    if (count(g) < count(trade)) fewer++;
    else if (count(g) === count(trade)) same++;
    else more++;
    if (g.finalErrorM < trade.finalErrorM) closer++;
    else if (g.finalErrorM > trade.finalErrorM) farther++;
  }
  return { fewer, same, more, closer, farther };
}

const started = Date.now();
const all: LoopResult[] = merge
  ? merge.split(",").flatMap((f) =>
      // JSON writes Infinity (nothing marked) as null
      (JSON.parse(readFileSync(f, "utf8")) as LoopResult[]).map((r) => ({
        ...r,
        finalErrorM: r.finalErrorM ?? Number.POSITIVE_INFINITY,
      })),
    )
  : [];
for (const family of merge ? [] : families) {
  for (let n = first; n < first + perFamily; n++) {
    for (const policy of policies) {
      const r = runLoop(family, n, policy);
      all.push(r);
      if (out) writeFileSync(out, JSON.stringify(all));
      console.log(
        `${family}-${n} ${policy.name}: ${r.alarmed ? `${r.readingsToFind ?? "not found"} readings to 0.6 m, final ${fmtError(r.finalErrorM)}, ${r.readingsTaken} taken` : "no alarm"}`,
      );
    }
  }
}
console.log(
  `\n| family | policy | alarmed | found within ${READING_BUDGET} | median readings to 0.6 m | median metres to 0.6 m | median final error m | final within 1.5 m | median readings taken |`,
);
console.log("| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
const shown = merge ? [tradeRule, guided] : policies;
for (const family of [...new Set(all.map((r) => r.family))]) {
  for (const policy of shown) {
    const s = summarise(all.filter((r) => r.family === family && r.policy === policy.name));
    console.log(
      `| ${family} | ${policy.name} | ${s.alarmed}/${s.stores} | ${s.found} of ${s.alarmed} | ${fmt(s.medianReadings, 1)} | ${fmtM(s.medianMetres)} | ${fmtError(s.medianFinalError)} | ${s.within15} of ${s.alarmed} | ${fmt(s.medianTaken, 1)} |`,
    );
  }
}
if (shown.length === 2) {
  console.log(
    "\n| family | guided to 0.6 m in fewer / as many / more readings | guided's final error smaller / larger |",
  );
  console.log("| --- | ---: | ---: |");
  for (const family of [...new Set(all.map((r) => r.family))]) {
    const p = paired(all.filter((r) => r.family === family));
    console.log(`| ${family} | ${p.fewer} / ${p.same} / ${p.more} | ${p.closer} / ${p.farther} |`);
  }
}
console.log(`\n${all.length} runs in ${((Date.now() - started) / 1000).toFixed(0)} s`);
