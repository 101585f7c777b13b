// npm run -s locate -- FILE.json [--field] [--readings] [--delay]
// Prints exactly one JSON object on stdout (docs/locator/command-line.md); problems go to stderr, exit non-zero.
import { readFileSync } from "node:fs";
import { LocatorInputError, parseLocatorInput } from "#core/contracts/locator-input";
import { locate } from "#core/analysis/locate";
import { commandLineOutput } from "#core/domain/locator-words/command-line-output";

function fail(message: string, code: number): never {
  process.stderr.write(`locate: ${message}\n`);
  process.exit(code);
}

const args = process.argv.slice(2);
const withField = args.includes("--field");
const withReadings = args.includes("--readings");
const withDelay = args.includes("--delay");
const files = args.filter((a) => !a.startsWith("--"));
if (files.length !== 1) fail("usage: npm run -s locate -- FILE.json [--field] [--readings] [--delay]", 64);

let raw: string;
try {
  raw = readFileSync(files[0], "utf8");
} catch (e) {
  fail(`cannot read ${files[0]}: ${(e as Error).message}`, 66);
}
let json: unknown;
try {
  json = JSON.parse(raw);
} catch (e) {
  fail(`${files[0]} is not valid JSON: ${(e as Error).message}`, 65);
}

try {
  const input = parseLocatorInput(json);
  const result = locate(input);
  const out: Record<string, unknown> = { ...commandLineOutput(input, result) };
  if (withReadings) out.readings = result.readings;
  // the delay checked against the readings: stated, estimated and used shift, s (docs/locator/pipeline.md)
  if (withDelay) out.delay = result.delay;
  if (withField) {
    const f = result.field;
    // NaN (unknown) is not JSON: unknown cells are written as null
    const num = (v: number) => (Number.isNaN(v) ? null : Math.round(v * 100) / 100);
    out.field = {
      width: f.width,
      height: f.height,
      cellSize: f.cellSize,
      values: Array.from(f.values, num),
      confidence: Array.from(f.confidence, num),
    };
  }
  process.stdout.write(JSON.stringify(out) + "\n");
} catch (e) {
  if (e instanceof LocatorInputError) fail(e.message, 65);
  fail(`analysis failed: ${(e as Error).stack ?? e}`, 70);
}
