// The locator's accuracy benchmark (`npm run bench:locate [-- --json|--detail] [--dir DIR] [--delay-scale F] [family ...]`): runs `locate`
// on every committed store in scripts/bench/scenarios/, scores it against the truth beside each file,
// and prints per family and overall figures for the locator and for the naive answer, then the
// targets of docs/benchmarks.md with pass/fail. It is a report: the exit code is 0 unless the script itself fails.
import { readdirSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Polygon } from "#core/analysis/geometry/types";
import {
  checkTargets,
  naiveAnswer,
  scoreStore,
  summarise,
  type StoreScore,
  type Summary,
  type Suspect,
  type Truth,
} from "./score";

const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
const dirFlag = args.indexOf("--dir");
// --dir scores another set (e.g. a held-out one from generate.ts --first 13 --out DIR).
const scenarioDir = dirFlag >= 0 ? (args.splice(dirFlag, 2)[1] ?? "") : join(here, "scenarios");
const scaleFlag = args.indexOf("--delay-scale");
// --delay-scale F multiplies every store's stated transport delay by F before the locator sees it (the
// readings stay as the simulated detector took them), to measure how the locator copes with a wrong delay.
const delayScaleText = scaleFlag >= 0 ? args.splice(scaleFlag, 2)[1] : "1";
const delayScale = Number(delayScaleText);
if (!(delayScale > 0) || !Number.isFinite(delayScale)) {
  console.error(`bench:locate: --delay-scale needs a positive number, got ${delayScaleText ?? "nothing"}`);
  process.exit(2);
}
const asJson = args.includes("--json");
const detail = args.includes("--detail");
const onlyFamilies = args.filter((a) => !a.startsWith("--"));

type LocateFn = (input: unknown) => unknown;

/** Imported at run time so the benchmark still scores the naive answer before the locator exists. */
async function loadLocator(): Promise<{ locate: LocateFn | null; why: string }> {
  const url = new URL("../../core/analysis/locate.ts", import.meta.url).href;
  try {
    const mod = (await import(url)) as { locate?: unknown };
    if (typeof mod.locate !== "function")
      return { locate: null, why: "core/analysis/locate.ts does not export a locate(input) function" };
    return { locate: mod.locate as LocateFn, why: "" };
  } catch (err) {
    const msg = err instanceof Error ? err.message : String(err);
    if (/Cannot find module|ERR_MODULE_NOT_FOUND/.test(msg) && msg.includes("locate")) {
      return { locate: null, why: "core/analysis/locate.ts is not there yet (merge the locator branch)" };
    }
    return { locate: null, why: `core/analysis/locate.ts failed to load: ${msg}` };
  }
}

function suspectsOf(result: unknown): Suspect[] {
  const candidates = (result as { candidates?: unknown })?.candidates;
  if (!Array.isArray(candidates)) throw new Error("locate result has no candidates array");
  return [...candidates]
    .sort((a, b) => (a.rank ?? 0) - (b.rank ?? 0))
    .map((c, k) => {
      if (!Number.isFinite(c.x) || !Number.isFinite(c.y)) throw new Error(`candidate ${k + 1} has no finite x/y`);
      return { x: c.x, y: c.y, radius: Number.isFinite(c.radius) ? c.radius : undefined };
    });
}

interface StoreFile {
  name: string;
  input: {
    plan: { backgroundZones?: { polygon: number[][] }[] };
    instrument: { alarmPpm?: number; transportDelayS: number };
    readings: { x: number; y: number; ppm: number }[];
  };
  truth: Truth;
}

function loadStores(): StoreFile[] {
  const names = readdirSync(scenarioDir)
    .filter((f) => f.endsWith(".json") && !f.endsWith(".truth.json"))
    .sort();
  if (names.length === 0) throw new Error(`no scenarios in ${scenarioDir}: run tsx scripts/bench/simulate/generate.ts`);
  return names
    .map((f) => ({
      name: f.replace(/\.json$/, ""),
      input: JSON.parse(readFileSync(join(scenarioDir, f), "utf8")),
      truth: JSON.parse(readFileSync(join(scenarioDir, f.replace(/\.json$/, ".truth.json")), "utf8")) as Truth,
    }))
    .filter((s) => onlyFamilies.length === 0 || onlyFamilies.includes(s.truth.family));
}

const fmt = (v: number | null, digits = 2) => (v === null ? "-" : Number.isFinite(v) ? v.toFixed(digits) : "inf");
const pct = (v: number | null) => (v === null ? "-" : `${(100 * v).toFixed(0)}%`);

function table(title: string, rows: [string, Summary][]): string {
  const head = [
    "family",
    "stores",
    "median top-1 m",
    "top-3 <=1.5 m",
    "misses",
    "false alarms",
    "in benign zone",
    "radius cover",
    "both in top-4",
  ];
  const body = rows.map(([name, s]) => [
    name,
    String(s.stores),
    fmt(s.medianTop1),
    pct(s.top3WithinShare),
    s.leakStores ? `${s.misses}/${s.leakStores}` : "-",
    s.noLeakStores ? `${s.falseAlarms}/${s.noLeakStores}` : "-",
    String(s.inBenignZone),
    pct(s.radiusCoverage),
    s.twoLeakStores ? pct(s.bothInTop4Share) : "-",
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((r) => r[c].length)));
  const line = (r: string[]) => r.map((v, c) => (c === 0 ? v.padEnd(widths[c]) : v.padStart(widths[c]))).join("  ");
  return [title, line(head), ...body.map(line)].join("\n");
}

function byFamily(stores: StoreFile[], scores: StoreScore[]): [string, Summary][] {
  const families = [...new Set(stores.map((s) => s.truth.family))];
  return [
    ...families.map((f) => [f, summarise(scores.filter((s) => s.family === f))] as [string, Summary]),
    ["overall", summarise(scores)],
  ];
}

async function main() {
  const stores = loadStores();
  const { locate, why } = await loadLocator();
  const naiveScores: StoreScore[] = [];
  const locatorScores: StoreScore[] = [];
  const failures: string[] = [];
  let elapsed = 0;
  for (const s of stores) {
    const zones = (s.input.plan.backgroundZones ?? []).map((z) => z.polygon as unknown as Polygon);
    naiveScores.push(scoreStore(s.truth, naiveAnswer(s.input.readings, s.input.instrument.alarmPpm ?? 2), zones));
    if (!locate) continue;
    let suspects: Suspect[] = [];
    try {
      const t0 = performance.now();
      const input =
        delayScale === 1
          ? s.input
          : {
              ...s.input,
              instrument: { ...s.input.instrument, transportDelayS: s.input.instrument.transportDelayS * delayScale },
            };
      const result = await Promise.resolve(locate(input));
      elapsed += performance.now() - t0;
      suspects = suspectsOf(result);
    } catch (err) {
      // A store the locator rejects is scored as if it named no suspect (a miss on a leak store).
      failures.push(`${s.name}: ${err instanceof Error ? err.message : String(err)}`);
    }
    locatorScores.push(scoreStore(s.truth, suspects, zones));
    if (detail) {
      const l = locatorScores[locatorScores.length - 1],
        n = naiveScores[naiveScores.length - 1];
      const r = suspects[0]?.radius;
      console.log(
        `${s.name.padEnd(16)} suspects ${String(suspects.length).padStart(2)}  top-1 ${fmt(l.top1Error).padStart(6)} m` +
          `  radius ${fmt(r ?? null).padStart(5)}  top-3<=1.5 ${l.top3Within ? "yes" : "no "}  naive ${fmt(n.top1Error).padStart(6)} m`,
      );
    }
  }
  const naive = byFamily(stores, naiveScores);
  const located = locate ? byFamily(stores, locatorScores) : null;
  const overall = (rows: [string, Summary][]) => rows[rows.length - 1][1];
  const targets = located ? checkTargets(overall(located), overall(naive)) : null;
  if (asJson) {
    console.log(
      JSON.stringify(
        {
          stores: stores.length,
          delayScale,
          locatorMissing: locate ? null : why,
          failures,
          naive,
          locator: located,
          targets,
        },
        null,
        1,
      ),
    );
    return;
  }
  const out: string[] = [
    `${stores.length} stores from ${scenarioDir}${delayScale === 1 ? "" : `, stated delay scaled by ${delayScale}`}`,
  ];
  out.push("", table("Naive answer (the spot of the highest raw reading, when it reaches the alarm):", naive));
  if (!located) {
    out.push("", `Locator not scored: ${why}.`);
  } else {
    out.push("", table(`Locator (${(elapsed / stores.length).toFixed(0)} ms per store):`, located));
    if (failures.length)
      out.push(
        "",
        `${failures.length} store(s) rejected by the locator (scored as no suspect):`,
        ...failures.map((f) => `  ${f}`),
      );
    out.push(
      "",
      "Targets (overall):",
      ...targets!.map((t) => `  [${t.pass === null ? "n/a " : t.pass ? "pass" : "FAIL"}] ${t.name}: ${t.detail}`),
    );
  }
  out.push(
    "",
    "Median top-1 counts a miss as an infinite error; top-3, radius cover and both-in-top-4 count a miss as a failure;",
    "false alarms are any suspect on a no-leak store; 'in benign zone' counts suspects inside a listed benign-source zone.",
  );
  console.log(out.join("\n"));
}

main().catch((err) => {
  console.error(`bench:locate failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
  process.exit(1);
});
