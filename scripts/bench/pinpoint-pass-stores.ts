// The pinpoint-pass family with the case the product advises stilling (pinpoint-pass/advised-case.ts) instead of the
// trade's rule: `tsx scripts/bench/pinpoint-pass-stores.ts N --first F --out DIR [--first-pass-out DIR2]`.
// Store F … F+N−1, each from the same stream as `simulate/generate.ts --family pinpoint-pass` makes it,
// so the first pass is the same bit for bit and only the stilled case (and what follows) may differ.
// --first-pass-out also writes each store without its pass, to score the first pass alone.
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { buildScenario } from "./simulate/scenario";
import { cliArgs } from "./cli-args";
import { storeName, storeStream } from "./simulate/store-types";
import { advisedPassCase, type AdvisedCase } from "./pinpoint-pass/advised-case";

const usage = "usage: tsx scripts/bench/pinpoint-pass-stores.ts N --first F --out DIR [--first-pass-out DIR2]";
const { args, option, fail } = cliArgs("pinpoint-pass generate", usage);
const outDir = option("--out") ?? fail("--out is needed");
const firstPassDir = option("--first-pass-out");
const first = Number(option("--first") ?? 1);
const count = Number(args[0] ?? 12);
if (!Number.isInteger(count) || count < 1 || count > 100) fail(`N must be an integer 1..100, got ${args[0]}`);
if (!Number.isInteger(first) || first < 1 || first > 9000) fail(`--first must be an integer 1..9000, got ${first}`);
for (const d of [outDir, firstPassDir]) if (d) mkdirSync(d, { recursive: true });

const tally = { own: 0, "settled-suspect": 0, mixing: 0, "no-advice": 0 };
for (let n = first; n < first + count; n++) {
  const t0 = Date.now();
  let advice = { why: "no-advice", fixtureId: null } as AdvisedCase;
  const s = buildScenario("pinpoint-pass", storeStream("pinpoint-pass", n), (firstPass) => {
    advice = advisedPassCase(firstPass);
    return advice.fixtureId;
  });
  const name = storeName("pinpoint-pass", n);
  writeFileSync(join(outDir, `${name}.json`), JSON.stringify(s.input) + "\n");
  writeFileSync(join(outDir, `${name}.truth.json`), JSON.stringify(s.truth, null, 1) + "\n");
  if (firstPassDir) {
    const { passes: _passes, ...rest } = s.input;
    const firstPass = { ...rest, readings: s.input.readings.filter((r) => r.pass === undefined) };
    writeFileSync(join(firstPassDir, `${name}.json`), JSON.stringify(firstPass) + "\n");
    writeFileSync(join(firstPassDir, `${name}.truth.json`), JSON.stringify(s.truth, null, 1) + "\n");
  }
  const stilled = s.input.passes?.[0]?.fixture;
  const own = s.truth.leaks.some((l) => l.fixtureId === stilled);
  tally[advice.why]++;
  if (own) tally.own++;
  console.log(
    `${name}: stilled ${stilled} (${advice.why === "no-advice" ? "no advice: the trade's rule" : advice.why}), ` +
      `leak at ${s.truth.leaks.map((l) => l.fixtureId).join("/")}${own ? " (its own case)" : ""}, ` +
      `${s.input.readings.length} readings, ${((Date.now() - t0) / 1000).toFixed(1)} s`,
  );
}
console.log(
  `${count} stores: the leak's own case stilled in ${tally.own}; settled suspect ${tally["settled-suspect"]}, ` +
    `level readings ${tally.mixing}, no advice (the trade's rule) ${tally["no-advice"]}`,
);
