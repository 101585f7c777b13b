/** Plan versions of a store, general to specific. */
export const plansKeys = {
  all: ["plans"] as const,
  lists: () => [...plansKeys.all, "list"] as const,
  list: (storeId: string) => [...plansKeys.lists(), { storeId }] as const,
  details: () => [...plansKeys.all, "detail"] as const,
  detail: (id: string) => [...plansKeys.details(), id] as const,
};

/**
 * A plan version's fixtures (GET /api/plans/:id/fixtures): a resource of their own, so that
 * invalidating plans (a count changed) never refetches an open editor's fixtures.
 */
export const fixturesKeys = {
  all: ["fixtures"] as const,
  lists: () => [...fixturesKeys.all, "list"] as const,
  list: (planId: string) => [...fixturesKeys.lists(), { planId }] as const,
};
