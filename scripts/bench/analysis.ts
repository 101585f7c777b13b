// npm run bench:analysis — speed of a full analysis (targets in docs/benchmarks.md), printed plainly.
// Each case runs in its own process so its peak memory (maxRSS) is its own, from this file compiled by
// esbuild as the server's workers and the command line run the locator (decision 0086): under tsx the
// TypeScript loader alone added about 55 MB to every peak.
import { build } from "esbuild";
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { locate } from "#core/analysis/locate";
import { syntheticStore } from "./synthetic-store";

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function child(kind: string, count: number, runs: number): Promise<void> {
  const input = parseLocatorInput(syntheticStore(count));
  // the process before any analysis (Node, the code, the store): the rest of the peak is the analysis's
  const rssBeforeMb = process.memoryUsage().rss / 1048576;
  const times: number[] = [];
  const cpu: number[] = [];
  if (kind === "locate") {
    for (let r = 0; r < runs; r++) {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      locate(input);
      times.push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu.push((c.user + c.system) / 1000);
    }
  } else {
    // @turf/interpolate's IDW on the same grid points (cell centres at 0.25 m) and readings; metres are
    // mapped to degrees at the equator as in docs/reference/locator-methods.md §4, weight 2 as in Shepard's IDW.
    const { default: interpolate } = await import("@turf/interpolate");
    const { featureCollection, point } = await import("@turf/helpers");
    const deg = (m: number) => (m * 180) / (Math.PI * 6371008.8);
    const fc = featureCollection(input.readings.map((p) => point([deg(p.x), -deg(p.y)], { ppm: p.ppm })));
    const h = 0.25;
    const bbox: [number, number, number, number] = [
      deg(h / 2),
      -deg(input.plan.height - h / 2),
      deg(input.plan.width - h / 2),
      -deg(h / 2),
    ];
    const t0 = performance.now();
    const grid = interpolate(fc, h, { gridType: "point", property: "ppm", units: "meters", weight: 2, bbox });
    times.push(performance.now() - t0);
    if (grid.features.length < 90_000)
      throw new Error(`turf grid has ${grid.features.length} points, expected about 96,000`);
  }
  const maxRssMb = process.resourceUsage().maxRSS / 1024;
  process.stdout.write(
    JSON.stringify({ median: median(times), cpuMedian: median(cpu), times, maxRssMb, rssBeforeMb }) + "\n",
  );
}

// On a machine shared with other work, wall-clock times swing with the load; the CPU time a run takes
// (user + system) swings much less, so both are printed, with the load average (docs/benchmarks.md).
const load = () =>
  loadavg()
    .map((v) => v.toFixed(1))
    .join(" / ");

/** CPU time (ms) used so far by this process's waited-for children (Linux /proc, clock ticks of 10 ms). */
function childrenCpuMs(): number {
  const stat = readFileSync("/proc/self/stat", "utf8");
  const fields = stat.slice(stat.lastIndexOf(") ") + 2).split(" ");
  // after "pid (comm) ", field 16 (cutime) and 17 (cstime) of proc(5) are at indexes 13 and 14
  return (Number(fields[13]) + Number(fields[14])) * 10;
}

// The children run this file compiled (npm packages from node_modules, so it is written inside the checkout).
const childFile = join(process.cwd(), "dist/bench/analysis.mjs");

async function buildChild(): Promise<void> {
  await build({
    entryPoints: [process.argv[1]],
    outfile: childFile,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: "external",
    logLevel: "warning",
  });
}

function runChild(
  kind: string,
  count: number,
  runs: number,
): { median: number; cpuMedian: number; times: number[]; maxRssMb: number; rssBeforeMb: number } {
  const out = execFileSync(process.execPath, [childFile, "--child", kind, String(count), String(runs)], {
    encoding: "utf8",
    maxBuffer: 1 << 24,
  });
  return JSON.parse(out.trim().split("\n").pop()!);
}

async function main(): Promise<void> {
  const argv = process.argv.slice(2);
  if (argv[0] === "--child") return child(argv[1], Number(argv[2]), Number(argv[3]));
  const skipTurf = argv.includes("--no-turf");
  console.log("Full analysis (lag, grid, geodesic searches, field map, source fit, diagnostics)");
  console.log(
    "on a synthetic 100 m x 60 m store at 0.25 m cells (400 x 240 = 96,000 cells) with walls and 16 lineups.",
  );
  console.log(`  load average at the start (1 / 5 / 15 min): ${load()}`);
  await buildChild();
  const r500 = runChild("locate", 500, 7);
  console.log(
    `  500 readings:   median ${r500.median.toFixed(0)} ms wall, ${r500.cpuMedian.toFixed(0)} ms CPU over ${r500.times.length} runs, peak memory ${r500.maxRssMb.toFixed(0)} MB, ${r500.rssBeforeMb.toFixed(0)} MB of it before the analysis (targets 250 ms, 200 MB)`,
  );
  const r2000 = runChild("locate", 2000, 5);
  console.log(
    `  2,000 readings: median ${r2000.median.toFixed(0)} ms wall, ${r2000.cpuMedian.toFixed(0)} ms CPU over ${r2000.times.length} runs, peak memory ${r2000.maxRssMb.toFixed(0)} MB, ${r2000.rssBeforeMb.toFixed(0)} MB of it before the analysis (targets 600 ms, 300 MB)`,
  );

  const dir = mkdtempSync(join(tmpdir(), "bench-locate-"));
  const file = join(dir, "store-500.json");
  writeFileSync(file, JSON.stringify(syntheticStore(500)));
  // The compiled command line (scripts/build.mjs), as `npm run -s locate` runs it, timed from
  // process start to exit; npm's own start-up is left out (it is not the tool's).
  execFileSync(process.execPath, ["scripts/build.mjs", "locate"], { stdio: "inherit" });
  const cli: number[] = [];
  const cliCpu: number[] = [];
  for (let r = 0; r < 7; r++) {
    const c0 = childrenCpuMs();
    const t0 = performance.now();
    const res = spawnSync(process.execPath, ["dist/scripts/locate.js", file], { encoding: "utf8" });
    cli.push(performance.now() - t0);
    cliCpu.push(childrenCpuMs() - c0);
    if (res.status !== 0) throw new Error(`locate CLI failed: ${res.stderr}`);
    JSON.parse(res.stdout);
  }
  console.log(
    `  command line, 500 readings, compiled, including process start-up: median ${median(cli).toFixed(0)} ms wall, ${median(cliCpu).toFixed(0)} ms CPU over ${cli.length} runs (target 350 ms)`,
  );
  console.log(`  load average at the end (1 / 5 / 15 min): ${load()}`);

  if (skipTurf) return;
  const turf = runChild("turf", 500, 1);
  console.log(
    `  @turf/interpolate IDW, same grid and 500 readings: ${turf.median.toFixed(0)} ms, peak memory ${turf.maxRssMb.toFixed(0)} MB`,
  );
  console.log(
    `  ratio: the full analysis is ${(turf.median / r500.median).toFixed(1)}x faster than turf's IDW (target at least 5x)`,
  );
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
