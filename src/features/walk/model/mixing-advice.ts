import type { Fixture } from "#core/contracts/fixtures";
import { AIR_KIND } from "#core/domain/layout/to-locator-input";
import { estimateBackground } from "#core/analysis/locator/background";
import { fansMixing } from "#core/analysis/locator/diagnostics";
import type { LocalPass, LocalReading, LocalSweep } from "./local-types";

/** A fixture whose fans, by the readings so far, are mixing the gas through it. */
export interface MixingAdvice {
  fixture: Fixture & { polygon: [number, number][] };
  /** Readings level across it, and the level they share, ppm. */
  count: number;
  levelPpm: number;
}

/** Whether this reading was taken while the fixture's fans ran (first pass running, no pass stilling it). */
function fansRanFor(
  r: LocalReading,
  fixtureId: string,
  sweep: Pick<LocalSweep, "fans">,
  passes: Map<string, LocalPass>,
) {
  if (!r.passId) return sweep.fans === "running";
  const p = passes.get(r.passId);
  if (!p) return sweep.fans === "running";
  const stills = p.fans === "stopped" || p.defrost;
  return !(stills && (p.fixtureId === null || p.fixtureId === fixtureId));
}

/**
 * The fixtures whose readings are level and elevated all across while their fans run: the locator's own
 * mixing test (core/analysis/locator/diagnostics.ts, `fansMixing`) on the readings committed so far, over
 * the background of those readings. Stopping the fans or a defrost lets the gas settle where it leaks.
 * Fixtures a pass already stilled are not advised again. The highest level comes first: with fans in
 * every case the gas of one leak reads level across several, and most of it where it leaks
 * (docs/decisions/0139).
 */
export function mixingAdvice(
  sweep: Pick<LocalSweep, "fans" | "passes">,
  fixtures: readonly Fixture[],
  committed: readonly LocalReading[],
  alarmPpm: number,
): MixingAdvice[] {
  if (committed.length < 4) return [];
  const passes = new Map(sweep.passes.map((p) => [p.id, p]));
  const stilled = new Set(sweep.passes.flatMap((p) => (p.fixtureId ? [p.fixtureId] : fixtures.map((f) => f.id))));
  const exact = committed.filter((r) => !r.atLeast);
  const background = estimateBackground(
    Float64Array.from(exact, (r) => r.ppm),
    new Uint8Array(exact.length).fill(1),
  ).ppm;
  const out: MixingAdvice[] = [];
  for (const f of fixtures) {
    const kind = AIR_KIND[f.kind];
    if (!f.hasFans || !kind || !("polygon" in f) || stilled.has(f.id)) continue;
    const running = committed.filter((r) => fansRanFor(r, f.id, sweep, passes));
    const polygon = f.polygon.map(([x, y]) => [x, y] as [number, number]);
    const d = fansMixing(
      { id: f.id, kind, polygon, fans: true },
      Float64Array.from(running, (r) => r.x),
      Float64Array.from(running, (r) => r.y),
      Float64Array.from(running, (r) => r.ppm),
      background,
      alarmPpm,
    );
    if (d && d.kind === "fans-mixing") out.push({ fixture: { ...f, polygon }, count: d.count, levelPpm: d.levelPpm });
  }
  return out.sort((a, b) => b.levelPpm - a.levelPpm);
}
