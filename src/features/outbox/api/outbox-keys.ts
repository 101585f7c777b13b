export const outboxKeys = {
  all: ["outbox"] as const,
  lists: () => [...outboxKeys.all, "list"] as const,
  list: () => [...outboxKeys.lists(), "newest-first"] as const,
};
