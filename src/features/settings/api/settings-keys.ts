export const settingsKeys = {
  all: ["settings"] as const,
  details: () => [...settingsKeys.all, "detail"] as const,
  company: () => [...settingsKeys.details(), "company"] as const,
  failedJobs: () => [...settingsKeys.all, "failed-jobs"] as const,
};
