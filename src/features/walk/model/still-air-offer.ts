import type { Fixture } from "#core/contracts/fixtures";
import { AIR_VOLUME_KINDS } from "#core/contracts/fixture-kinds";
import type { LiveSuspect } from "#core/analysis/guide/live-guide";
import type { LocalSweep } from "./local-types";

const AIR_KINDS = new Set<string>(AIR_VOLUME_KINDS);

/**
 * The fixture to offer a still-air pass over once the live first suspect has settled on it: a case,
 * walk-in or machine room whose fans run in this sweep and that no pass has stilled yet. The server's
 * analysis gives every such spot the same next check (stop its fans or wait for a defrost, then re-check
 * close; core/analysis/locator/spot-facts.ts), and the readings need not be level across it for the
 * fans to spread the gas over the suspect's radius. Null while a pass is open, or for any other spot.
 */
export function stillAirOffer(
  sweep: Pick<LocalSweep, "fans" | "passes">,
  fixtures: readonly Fixture[],
  settled: Pick<LiveSuspect, "fixtureId"> | null,
): Fixture | null {
  if (!settled?.fixtureId || sweep.fans !== "running") return null;
  if (sweep.passes.some((p) => p.endedAt === null || p.fixtureId === null || p.fixtureId === settled.fixtureId))
    return null;
  const f = fixtures.find((x) => x.id === settled.fixtureId);
  return f && f.hasFans && AIR_KINDS.has(f.kind) ? f : null;
}
