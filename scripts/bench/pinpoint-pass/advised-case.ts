// Which case the product advises stilling after a first pass, for the simulator's pinpoint-pass family
// (the simulator never imports locator code, so this harness asks and hands it the answer as data).
// The same order as the Walk screen (docs/decisions/0139): the offer on the live first suspect once it
// has held over the last three estimates, at a case whose fans run; else the fans-mixing advice (the
// locator's own test: readings level and elevated across a case whose fans run), the highest level first.
import { parseLocatorInput, type LocatorInput } from "#core/contracts/locator-input";
import { estimateBackground } from "#core/analysis/locator/background";
import { fansMixing } from "#core/analysis/locator/diagnostics";
import { liveFit, type LiveSuspect } from "#core/analysis/guide/live-guide";

/** Live estimates the first suspect must hold over (the Walk screen's SETTLE_ESTIMATES, decision 0106). */
const SETTLE_ESTIMATES = 3;

export type AdvisedCase =
  | { why: "mixing" | "settled-suspect"; fixtureId: string }
  | { why: "no-advice"; fixtureId: null };

const CASE_KINDS = new Set(["open-case", "door-case", "island-case"]);

export function advisedPassCase(raw: unknown): AdvisedCase {
  const input = parseLocatorInput(raw);
  const settled = settledSuspect(input);
  const f = settled?.fixtureId ? input.plan.fixtures.find((x) => x.id === settled.fixtureId) : undefined;
  if (f && f.fans && CASE_KINDS.has(f.kind)) return { why: "settled-suspect", fixtureId: f.id };
  const mixing = mixingCase(input);
  if (mixing) return { why: "mixing", fixtureId: mixing };
  return { why: "no-advice", fixtureId: null };
}

/** The case whose readings are level and elevated across it at the highest level while its fans run (model/mixing-advice.ts's test). */
function mixingCase(input: LocatorInput): string | null {
  const exact = input.readings.filter((r) => !r.atLeast);
  const background = estimateBackground(
    Float64Array.from(exact, (r) => r.ppm),
    new Uint8Array(exact.length).fill(1),
  ).ppm;
  const xs = Float64Array.from(input.readings, (r) => r.x);
  const ys = Float64Array.from(input.readings, (r) => r.y);
  const ppm = Float64Array.from(input.readings, (r) => r.ppm);
  let best: { id: string; level: number } | null = null;
  for (const f of input.plan.fixtures) {
    if (!CASE_KINDS.has(f.kind)) continue;
    const d = fansMixing(f, xs, ys, ppm, background, input.instrument.alarmPpm);
    if (d?.kind === "fans-mixing" && (!best || d.levelPpm > best.level)) best = { id: f.id, level: d.levelPpm };
  }
  return best?.id ?? null;
}

/** The live first suspect after each of the last readings, when it stayed within the latest one's radius. */
function settledSuspect(input: LocatorInput): LiveSuspect | null {
  const firsts: LiveSuspect[] = [];
  for (let k = SETTLE_ESTIMATES - 1; k >= 0; k--) {
    const readings = input.readings.slice(0, input.readings.length - k);
    if (readings.length === 0) return null;
    const e = liveFit({ ...input, readings }).estimate;
    if (e.kind !== "suspects") return null;
    firsts.push(e.suspects[0]);
  }
  const last = firsts[firsts.length - 1];
  return firsts.every((f) => Math.hypot(f.x - last.x, f.y - last.y) <= last.radius) ? last : null;
}
