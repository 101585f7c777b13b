import type { Fixture } from "#core/contracts/fixtures";

/**
 * The system a leak marked at a fixture is recorded on: the fixture's system while it is in service.
 * A plan can still link a fixture to a retired system (its records are kept as they are), and the
 * server refuses a finding on one, so the leak is recorded without a system instead of being refused
 * out of sight in the queue and marked again the same way.
 */
export function findingSystemId(
  fixtures: readonly Pick<Fixture, "id" | "systemId">[],
  fixtureId: string | null,
  inServiceSystemIds: ReadonlySet<string>,
): string | null {
  const systemId = fixtures.find((f) => f.id === fixtureId)?.systemId ?? null;
  return systemId && inServiceSystemIds.has(systemId) ? systemId : null;
}
