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

const median = (xs: number[]) => {
  if (xs.length === 0) return Number.NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const fmt = (v: number, digits = 1) => (Number.isFinite(v) ? v.toFixed(digits) : "never");

function summarise(rows: LoopResult[]) {
  const alarmed = rows.filter((r) => r.alarmed);
  const found = alarmed.filter((r) => r.readingsToFind !== null);
  // A store never found counts as more readings than the budget, so the median stays honest.
  const readings = alarmed.map((r) => r.readingsToFind ?? Number.POSITIVE_INFINITY);
  return {
    stores: rows.length,
    alarmed: alarmed.length,
    medianReadings: median(readings),
    medianMetres: median(alarmed.map((r) => r.metresToFind ?? Number.POSITIVE_INFINITY)),
    within40: alarmed.length ? found.length / alarmed.length : Number.NaN,
    medianFinalError: median(alarmed.map((r) => r.finalErrorM)),
  };
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
        `${family}-${n} ${policy.name}: ${r.alarmed ? `${r.readingsToFind ?? "not found"} readings to 0.6 m, final ${fmt(r.finalErrorM, 2)} m, ${r.readingsTaken} taken` : "no alarm"}`,
      );
    }
  }
}
console.log(
  `\n| family | policy | alarmed | median readings to 0.6 m | median metres | found within ${READING_BUDGET} | median final error m |`,
);
console.log("| --- | --- | ---: | ---: | ---: | ---: | ---: |");
for (const family of [...new Set(all.map((r) => r.family))]) {
  for (const policy of merge ? [tradeRule, guided] : policies) {
    const s = summarise(all.filter((r) => r.family === family && r.policy === policy.name));
    console.log(
      `| ${family} | ${policy.name} | ${s.alarmed}/${s.stores} | ${fmt(s.medianReadings, 0)} | ${fmt(s.medianMetres)} | ${fmt(100 * s.within40, 0)}% | ${fmt(s.medianFinalError, 2)} |`,
    );
  }
}
console.log(`\n${all.length} runs in ${((Date.now() - started) / 1000).toFixed(0)} s`);
