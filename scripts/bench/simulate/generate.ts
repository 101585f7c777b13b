// Regenerates the committed benchmark stores: `tsx scripts/bench/simulate/generate.ts [perFamily]`.
// Each store is rebuilt from its family and number alone, so the files are reproducible bit for bit.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { buildScenario, FAMILIES } from "./scenario";

const here = dirname(fileURLToPath(import.meta.url));
const outDir = join(here, "..", "scenarios");
const perFamily = Number(process.argv[2] ?? 10);
if (!Number.isInteger(perFamily) || perFamily < 1 || perFamily > 100) {
  console.error(`generate: stores per family must be an integer 1..100, got ${process.argv[2]}`);
  process.exit(2);
}
mkdirSync(outDir, { recursive: true });
let bytes = 0;
const started = Date.now();
FAMILIES.forEach((family, fi) => {
  for (let n = 1; n <= perFamily; n++) {
    const t0 = Date.now();
    // A fixed, distinct stream per (family, number): adding stores never changes existing ones.
    const s = buildScenario(family, 7919 * (fi + 1) + 104729 * n);
    const name = `${family}-${String(n).padStart(2, "0")}`;
    const input = JSON.stringify(s.input);
    writeFileSync(join(outDir, `${name}.json`), input + "\n");
    writeFileSync(join(outDir, `${name}.truth.json`), JSON.stringify(s.truth, null, 1) + "\n");
    bytes += input.length;
    console.log(
      `${name}: ${s.input.plan.width} x ${s.input.plan.height} m, ${s.notes.cells} cells of ${s.notes.cellSize} m, ` +
        `${s.input.readings.length} readings, solver iterations ${s.notes.solveIterations.join("/") || "-"}, ` +
        `peak ${s.notes.peakPpm.join("/") || "-"} ppm, ${((Date.now() - t0) / 1000).toFixed(1)} s`,
    );
  }
});
console.log(`${FAMILIES.length * perFamily} stores, ${(bytes / 1e6).toFixed(2)} MB, ${((Date.now() - started) / 1000).toFixed(0)} s`);
