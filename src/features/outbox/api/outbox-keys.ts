export const outboxKeys = {
  all: ["outbox"] as const,
  lists: () => [...outboxKeys.all, "list"] as const,
  list: () => [...outboxKeys.lists(), "newest-first"] as const,
  /** The company's mail not yet delivered. */
  onItsWay: () => [...outboxKeys.all, "on-its-way"] as const,
};
