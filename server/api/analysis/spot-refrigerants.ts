import { and, eq, isNotNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { SuspectSpot, SuspectSpotWithRefrigerant } from "#core/contracts/analysis";
import { fixtures, systems } from "../../db/schema/index";
import { spotRefrigerant, type FixtureSystem } from "#core/domain/locator-words/spot-refrigerant";

/** Fixture id → the system it hangs off (name and refrigerant), for one plan version. */
export async function fixtureSystems(ctx: AppContext, planId: string): Promise<Map<string, FixtureSystem>> {
  const rows = await ctx.db
    .select({ fixtureId: fixtures.id, systemName: systems.name, refrigerantId: systems.refrigerantId })
    .from(fixtures)
    .innerJoin(systems, eq(systems.id, fixtures.systemId))
    .where(and(eq(fixtures.planId, planId), isNotNull(fixtures.systemId)));
  return new Map(rows.map((r) => [r.fixtureId, { systemName: r.systemName, refrigerantId: r.refrigerantId }]));
}

/**
 * Each spot with the refrigerant its strength is weighed in, looked up when the analysis is read so a
 * fixture linked to a system after the analysis ran counts at once.
 */
export async function withRefrigerants(
  ctx: AppContext,
  planId: string,
  spots: readonly SuspectSpot[],
): Promise<SuspectSpotWithRefrigerant[]> {
  const bySystem = spots.some((s) => s.fixtureId) ? await fixtureSystems(ctx, planId) : new Map();
  return spots.map((s) => ({ ...s, refrigerant: spotRefrigerant(s.fixtureId, (id) => bySystem.get(id) ?? null) }));
}
