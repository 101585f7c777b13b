import { and, eq, isNotNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { SuspectSpot, SuspectSpotWithRefrigerant } from "#core/contracts/analysis";
import { fixtures, systems } from "../../db/schema/index";
import { spotRefrigerant, type FixtureSystem } from "#core/domain/locator-words/spot-refrigerant";
import { findRefrigerant } from "#core/domain/refrigerants/catalogue";
import { lookupFor } from "../refrigerants/company-refrigerant-lookup";

/** Fixture id → the system it hangs off (name and refrigerant), for one plan version, and its company. */
async function fixtureSystems(ctx: AppContext, planId: string) {
  const rows = await ctx.db
    .select({
      fixtureId: fixtures.id,
      systemName: systems.name,
      refrigerantId: systems.refrigerantId,
      companyId: systems.companyId,
    })
    .from(fixtures)
    .innerJoin(systems, eq(systems.id, fixtures.systemId))
    .where(and(eq(fixtures.planId, planId), isNotNull(fixtures.systemId)));
  const bySystem = new Map<string, FixtureSystem>(
    rows.map((r) => [r.fixtureId, { systemName: r.systemName, refrigerantId: r.refrigerantId }]),
  );
  return { bySystem, companyId: rows[0]?.companyId ?? null };
}

/**
 * Each spot with the refrigerant its strength is weighed in, looked up when the analysis is read so a
 * fixture linked to a system after the analysis ran counts at once. A company's own refrigerant is
 * found among that company's (docs/decisions/0073).
 */
export async function withRefrigerants(
  ctx: AppContext,
  planId: string,
  spots: readonly SuspectSpot[],
): Promise<SuspectSpotWithRefrigerant[]> {
  const { bySystem, companyId } = spots.some((s) => s.fixtureId)
    ? await fixtureSystems(ctx, planId)
    : { bySystem: new Map<string, FixtureSystem>(), companyId: null };
  const lookup = companyId ? await lookupFor(ctx, companyId) : findRefrigerant;
  return spots.map((s) => ({
    ...s,
    refrigerant: spotRefrigerant(s.fixtureId, (id) => bySystem.get(id) ?? null, lookup),
  }));
}
