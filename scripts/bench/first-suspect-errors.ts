// Where the first suspect sits against the true leak, store by store (`tsx scripts/bench/first-suspect-errors.ts
// DIR [family ...] [--delay-scale F] [--settings JSON]`): the error split along and across the leak's
// fixture (its long axis), whether the spot is in the leak's fixture, and a histogram per family.
// `--settings` deep-merges a JSON object into the locator's settings, for experiments without editing code.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { pointInPolygon } from "#core/analysis/geometry/point-in-polygon";
import type { Polygon, Vec } from "#core/analysis/geometry/types";
import { locate } from "#core/analysis/locate";
import { settingsWith } from "./settings-override";
import { parseLocatorInput } from "#core/contracts/locator-input";

const args = process.argv.slice(2);
const take = (flag: string) => {
  const i = args.indexOf(flag);
  return i >= 0 ? args.splice(i, 2)[1] : undefined;
};
const scale = Number(take("--delay-scale") ?? "1");
const settingsJson = take("--settings");
const [dir, ...families] = args;

const settings = settingsWith(settingsJson);

interface Fixture {
  id: string;
  polygon: number[][];
}
const axes = (f: Fixture) => {
  const xs = f.polygon.map((p) => p[0]);
  const ys = f.polygon.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  return x1 - x0 >= y1 - y0
    ? { along: 0, c: (x0 + x1) / 2, half: (x1 - x0) / 2 }
    : { along: 1, c: (y0 + y1) / 2, half: (y1 - y0) / 2 };
};

const rows: string[] = [];
const byFamily = new Map<string, number[]>();
const counts = new Map<string, { top3: number; both4: number; covered: number }>();
const files = readdirSync(dir)
  .filter((f) => f.endsWith(".json") && !f.endsWith(".truth.json"))
  .filter((f) => families.length === 0 || families.some((fam) => f.startsWith(`${fam}-`)))
  .sort();
let cpu = 0;
for (const f of files) {
  const name = f.replace(/\.json$/, "");
  const truth = JSON.parse(readFileSync(join(dir, `${name}.truth.json`), "utf8"));
  if (truth.leaks.length === 0) continue;
  const raw = JSON.parse(readFileSync(join(dir, f), "utf8"));
  raw.instrument.transportDelayS *= scale;
  const input = parseLocatorInput(raw);
  const t0 = process.cpuUsage();
  const r = locate(input, {}, settings);
  const dt = process.cpuUsage(t0);
  cpu += (dt.user + dt.system) / 1000;
  const s = r.candidates[0];
  const c = counts.get(truth.family) ?? { top3: 0, both4: 0, covered: 0 };
  counts.set(truth.family, c);
  const d = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
  type P = { x: number; y: number };
  if (r.candidates.slice(0, 3).some((k) => truth.leaks.some((l: P) => d(k, l) <= 1.5))) c.top3++;
  if (truth.leaks.every((l: P) => r.candidates.slice(0, 4).some((k) => d(k, l) <= 1.5))) c.both4++;
  if (s && Math.min(...truth.leaks.map((l: P) => d(s, l))) <= s.radius) c.covered++;
  const list = byFamily.get(truth.family) ?? [];
  byFamily.set(truth.family, list);
  if (!s) {
    list.push(Number.POSITIVE_INFINITY);
    rows.push(`${name.padEnd(18)} miss`);
    continue;
  }
  const leak = truth.leaks.reduce((a: { x: number; y: number }, b: { x: number; y: number }) =>
    Math.hypot(a.x - s.x, a.y - s.y) <= Math.hypot(b.x - s.x, b.y - s.y) ? a : b,
  );
  const err = Math.hypot(leak.x - s.x, leak.y - s.y);
  list.push(err);
  const fx = (raw.plan.fixtures as Fixture[]).find((x) => x.id === leak.fixtureId);
  let detail = "";
  if (fx) {
    const a = axes(fx);
    const pos = (p: { x: number; y: number }) => (a.along === 0 ? p.x : p.y);
    const cross = (p: { x: number; y: number }) => (a.along === 0 ? p.y : p.x);
    const inFx = pointInPolygon([s.x, s.y] as Vec, fx.polygon as unknown as Polygon);
    const top3 = r.candidates
      .slice(0, 3)
      .map((c) => Math.min(...truth.leaks.map((l: { x: number; y: number }) => Math.hypot(l.x - c.x, l.y - c.y))));
    detail =
      `along ${(pos(s) - pos(leak)).toFixed(2).padStart(6)} across ${(cross(s) - cross(leak)).toFixed(2).padStart(6)}` +
      `  leak@${((pos(leak) - a.c) / a.half).toFixed(2).padStart(5)} spot@${((pos(s) - a.c) / a.half).toFixed(2).padStart(5)} of half-length ${a.half.toFixed(2)}` +
      `  ${inFx ? "in-case " : `other:${s.fixtureId ?? "-"}`} ${leak.kind.padEnd(9)} top3 ${Math.min(...top3).toFixed(2)}  delay ${r.delay.usedS}`;
  }
  rows.push(`${name.padEnd(18)} ${err.toFixed(2).padStart(6)} m  ${detail}`);
}
console.log(rows.join("\n"));
const edges = [0.25, 0.5, 0.75, 1, 1.5, 2, 3, Number.POSITIVE_INFINITY];
for (const [fam, errs] of byFamily) {
  const sorted = [...errs].sort((a, b) => a - b);
  const median =
    sorted.length % 2
      ? sorted[(sorted.length - 1) / 2]
      : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
  const hist = edges.map((e, k) => sorted.filter((v) => v <= e && (k === 0 || v > edges[k - 1])).length);
  const c = counts.get(fam)!;
  console.log(
    `${fam.padEnd(14)} median ${median.toFixed(2)} m  top3 ${c.top3}/${errs.length} both4 ${c.both4} radius ${c.covered}  hist ≤0.25/0.5/0.75/1/1.5/2/3/∞: ${hist.join(" ")}`,
  );
}
const all = [...byFamily.values()].flat().sort((a, b) => a - b);
console.log(
  `all ${all.length} median ${all[Math.floor((all.length - 1) / 2)].toFixed(2)}/${all[Math.ceil((all.length - 1) / 2)].toFixed(2)} m, CPU ${(cpu / 1000).toFixed(1)} s`,
);
