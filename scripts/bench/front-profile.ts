// Diagnostic (reads the truth, so it measures, never tunes): the lag-corrected readings in front of the
// leak's display case (its open side or sides, case-back.ts) and along its lineup, binned along the case's
// long axis, with the case's ends, the neighbouring cases, the true leak and the first suspect. `tsx scripts/bench/front-profile.ts DIR STORE [STORE ...]
// [--settings JSON] [--bin M] [--reach M]`.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { createPlanGrid } from "#core/analysis/grid/plan-grid";
import { locate } from "#core/analysis/locate";
import { caseBack } from "#core/analysis/locator/case-back";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { settingsWith } from "./settings-override";

const args = process.argv.slice(2);
const take = (flag: string) => {
  const i = args.indexOf(flag);
  return i >= 0 ? args.splice(i, 2)[1] : undefined;
};
const settings = settingsWith(take("--settings"));
const bin = Number(take("--bin") ?? "0.4");
const reach = Number(take("--reach") ?? "1.5");
const [dir, ...stores] = args;

type Rect = { x0: number; x1: number; y0: number; y1: number };
const rectOf = (polygon: number[][]): Rect => {
  const xs = polygon.map((p) => p[0]);
  const ys = polygon.map((p) => p[1]);
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) };
};

for (const name of stores) {
  const raw = JSON.parse(readFileSync(join(dir, `${name}.json`), "utf8"));
  const truth = JSON.parse(readFileSync(join(dir, `${name}.truth.json`), "utf8"));
  const input = parseLocatorInput(raw);
  const r = locate(input, {}, settings);
  for (const leak of truth.leaks) {
    const fx = raw.plan.fixtures.find((f: { id: string }) => f.id === leak.fixtureId);
    if (!fx) continue;
    const c = rectOf(fx.polygon);
    const alongX = c.x1 - c.x0 >= c.y1 - c.y0;
    const [a0, a1, b0, b1] = alongX ? [c.x0, c.x1, c.y0, c.y1] : [c.y0, c.y1, c.x0, c.x1];
    // the open side(s): away from the back line (both for an island, whose back is its centre line)
    const grid = createPlanGrid(
      input.plan.width,
      input.plan.height,
      0.25,
      input.plan.obstacles.map((b) => b.polygon),
    );
    const back = caseBack(input.plan.fixtures.find((f) => f.id === fx.id)!, grid);
    const mid = (b0 + b1) / 2;
    const openLow = !back || back.at >= mid - 1e-9;
    const openHigh = !back || back.at <= mid + 1e-9;
    const pos = (x: number, y: number) => (alongX ? x : y);
    const cross = (x: number, y: number) => (alongX ? y : x);
    // readings within `reach` of the case's long sides, 5 m past each end
    const lo = a0 - 5;
    const hi = a1 + 5;
    const bins = new Map<number, { sum: number; n: number; max: number; side: string }>();
    for (const rd of r.readings) {
      const p = pos(rd.corrected.x, rd.corrected.y);
      const q = cross(rd.corrected.x, rd.corrected.y);
      const off = q < b0 ? b0 - q : q > b1 ? q - b1 : 0;
      if (p < lo || p > hi || off > reach || (q < b0 && !openLow) || (q > b1 && !openHigh)) continue;
      const k = Math.floor((p - lo) / bin);
      const e = bins.get(k) ?? { sum: 0, n: 0, max: 0, side: "" };
      e.sum += rd.ppm;
      e.n++;
      e.max = Math.max(e.max, rd.ppm);
      const side = q < b0 ? "-" : q > b1 ? "+" : "i";
      if (!e.side.includes(side)) e.side += side;
      bins.set(k, e);
    }
    const neighbours = raw.plan.fixtures
      .filter((f: { id: string }) => f.id !== fx.id)
      .map((f: { id: string; polygon: number[][] }) => ({ id: f.id, r: rectOf(f.polygon) }))
      .filter(({ r: o }: { r: Rect }) => {
        const [oa0, oa1, ob0, ob1] = alongX ? [o.x0, o.x1, o.y0, o.y1] : [o.y0, o.y1, o.x0, o.x1];
        return oa1 > lo && oa0 < hi && ob1 > b0 - 0.5 && ob0 < b1 + 0.5;
      });
    const s = r.candidates[0];
    console.log(
      `${name} ${fx.id} ${fx.kind} along ${alongX ? "x" : "y"} [${a0.toFixed(2)}, ${a1.toFixed(2)}] cross [${b0.toFixed(2)}, ${b1.toFixed(2)}]  leak ${pos(leak.x, leak.y).toFixed(2)} (${leak.kind}, cross ${cross(leak.x, leak.y).toFixed(2)})  spot ${s ? `${pos(s.x, s.y).toFixed(2)} cross ${cross(s.x, s.y).toFixed(2)}` : "none"}  delay ${r.delay.usedS}`,
    );
    console.log(
      `  lineup: ${neighbours.map((o: { id: string; r: Rect }) => `${o.id} [${(alongX ? o.r.x0 : o.r.y0).toFixed(2)}, ${(alongX ? o.r.x1 : o.r.y1).toFixed(2)}]`).join("  ")}`,
    );
    const leakAt = pos(leak.x, leak.y);
    const spotAt = s ? pos(s.x, s.y) : Number.NaN;
    for (const k of [...bins.keys()].sort((u, v) => u - v)) {
      const e = bins.get(k)!;
      const from = lo + k * bin;
      const mark =
        (leakAt >= from && leakAt < from + bin ? " <leak" : "") +
        (spotAt >= from && spotAt < from + bin ? " <spot" : "") +
        (a0 >= from && a0 < from + bin ? " |case start" : "") +
        (a1 >= from && a1 < from + bin ? " |case end" : "");
      const mean = e.sum / e.n;
      console.log(
        `  ${from.toFixed(2).padStart(6)} ${mean.toFixed(1).padStart(5)} (n ${String(e.n).padStart(2)}, max ${String(e.max).padStart(3)}, ${e.side.padEnd(3)}) ${"#".repeat(Math.round(mean))}${mark}`,
      );
    }
  }
}
