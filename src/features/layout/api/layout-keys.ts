export const layoutKeys = {
  all: ["layout"] as const,
  fixtures: () => [...layoutKeys.all, "fixtures"] as const,
  planFixtures: (planId: string) => [...layoutKeys.fixtures(), planId] as const,
};
