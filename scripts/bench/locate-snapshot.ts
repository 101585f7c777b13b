// Writes the locator's full result for every store of a set (`tsx scripts/bench/locate-snapshot.ts DIR OUT`),
// or compares two such snapshots (`--compare A B`): a refactor that should change nothing is checked
// store by store, suspects, diagnostics, corrected readings and the field map alike.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { createHash } from "node:crypto";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { locate } from "#core/analysis/locate";

const args = process.argv.slice(2);
if (args[0] === "--compare") {
  const [a, b] = [args[1], args[2]];
  let same = 0;
  const differ: string[] = [];
  for (const f of readdirSync(a).filter((x) => x.endsWith(".json"))) {
    const x = readFileSync(join(a, f), "utf8");
    let y = "";
    try {
      y = readFileSync(join(b, f), "utf8");
    } catch {
      differ.push(`${f}: missing`);
      continue;
    }
    if (x === y) same++;
    else differ.push(f);
  }
  console.log(`${same} identical, ${differ.length} differ${differ.length ? `: ${differ.join(", ")}` : ""}`);
  process.exit(differ.length ? 1 : 0);
}
const [dir, out] = args;
mkdirSync(out, { recursive: true });
const hash = (a: ArrayLike<number>) =>
  createHash("sha256")
    .update(Buffer.from(Float32Array.from(a as ArrayLike<number>).buffer))
    .digest("hex");
for (const f of readdirSync(dir).filter((x) => x.endsWith(".json") && !x.endsWith(".truth.json"))) {
  const r = locate(parseLocatorInput(JSON.parse(readFileSync(join(dir, f), "utf8"))));
  const snapshot = {
    candidates: r.candidates,
    background: r.background,
    diagnostics: r.diagnostics,
    assumptions: r.assumptions,
    readings: r.readings,
    delay: r.delay,
    field: {
      width: r.field.width,
      height: r.field.height,
      values: hash(r.field.values),
      confidence: hash(r.field.confidence),
    },
  };
  writeFileSync(join(out, f), JSON.stringify(snapshot, null, 1));
}
