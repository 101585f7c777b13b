import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { locate } from "#core/analysis/locate";
const [dir, scale] = process.argv.slice(2);
for (const f of readdirSync(dir).filter((x) => /^single-.*\d\.json$/.test(x))) {
  const raw = JSON.parse(readFileSync(join(dir, f), "utf8"));
  raw.instrument.transportDelayS *= Number(scale);
  const input = parseLocatorInput(raw);
  const r = locate(input);
  if (r.candidates.length === 0) {
    const peak = Math.max(...input.readings.map((x) => x.ppm));
    console.log(
      f,
      "peak",
      peak,
      "alarm",
      input.instrument.alarmPpm,
      JSON.stringify(r.delay),
      r.diagnostics.map((d) => d.kind).join(","),
    );
  }
}
