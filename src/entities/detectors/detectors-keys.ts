/** The company's detectors, general to specific. */
export const detectorsKeys = {
  all: ["detectors"] as const,
  lists: () => [...detectorsKeys.all, "list"] as const,
  list: (includeArchived: boolean) => [...detectorsKeys.lists(), { includeArchived }] as const,
};
