// Regenerates the committed benchmark stores: `tsx scripts/bench/simulate/generate.ts 12`.
// Each store is rebuilt from its family and number alone, so the files are reproducible bit for bit.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { buildScenario } from "./scenario";
import { cliArgs } from "../cli-args";
import { FAMILIES, ON_REQUEST_FAMILIES, storeName, storeStream } from "./store-types";

const here = dirname(fileURLToPath(import.meta.url));
const usage = "usage: tsx scripts/bench/simulate/generate.ts [storesPerFamily] [--first N] [--out DIR] [--family NAME]";
const { args, option, fail } = cliArgs("generate", usage);
// A held-out set (e.g. --first 13 --out /tmp/holdout) uses store numbers the committed set does not,
// so a radius calibrated on the committed stores can be checked on stores it has never seen.
const outDir = option("--out") ?? join(here, "..", "scenarios");
// --family NAME makes one family's stores only (their streams are the same as in a full run); a family
// made only on request (ON_REQUEST_FAMILIES) is made only so.
const onlyFamily = option("--family");
if (onlyFamily !== undefined && !(FAMILIES as readonly string[]).includes(onlyFamily))
  fail(`--family must be one of ${FAMILIES.join(", ")}, got ${onlyFamily}`);
const first = Number(option("--first") ?? 1);
const perFamily = Number(args[0] ?? 10);
if (!Number.isInteger(perFamily) || perFamily < 1 || perFamily > 100)
  fail(`stores per family must be an integer 1..100, got ${args[0]}`);
if (!Number.isInteger(first) || first < 1 || first > 9000) fail(`--first must be an integer 1..9000, got ${first}`);
mkdirSync(outDir, { recursive: true });
let bytes = 0;
const faulty: string[] = [];
const started = Date.now();
FAMILIES.forEach((family) => {
  if (onlyFamily !== undefined ? family !== onlyFamily : ON_REQUEST_FAMILIES.includes(family)) return;
  for (let n = first; n < first + perFamily; n++) {
    const t0 = Date.now();
    const s = buildScenario(family, storeStream(family, n));
    const name = storeName(family, n);
    const input = JSON.stringify(s.input);
    writeFileSync(join(outDir, `${name}.json`), input + "\n");
    writeFileSync(join(outDir, `${name}.truth.json`), JSON.stringify(s.truth, null, 1) + "\n");
    bytes += input.length;
    if (s.notes.samplesInSolid > 0) faulty.push(name);
    console.log(
      `${name}: ${s.input.plan.width} x ${s.input.plan.height} m, ${s.notes.cells} cells of ${s.notes.cellSize} m, ` +
        `${s.input.readings.length} readings, solver iterations ${s.notes.solveIterations.join("/") || "-"}, ` +
        `peak ${s.notes.peakPpm.join("/") || "-"} ppm, ${s.notes.samplesInSolid ? `${s.notes.samplesInSolid} probe samples on solid cells, ` : ""}${((Date.now() - t0) / 1000).toFixed(1)} s`,
    );
  }
});
console.log(
  `${(onlyFamily ? 1 : FAMILIES.length - ON_REQUEST_FAMILIES.length) * perFamily} stores, ${(bytes / 1e6).toFixed(2)} MB, ${((Date.now() - started) / 1000).toFixed(0)} s`,
);
if (faulty.length) {
  // The probe was routed onto a solid body: a layout or routing fault, not a valid benchmark store.
  console.error(`generate: probe on solid cells in ${faulty.join(", ")}`);
  process.exit(1);
}
