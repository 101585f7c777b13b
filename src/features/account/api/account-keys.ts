export const accountKeys = {
  all: ["account"] as const,
  sessions: () => [...accountKeys.all, "sessions"] as const,
  securityLog: () => [...accountKeys.all, "security-log"] as const,
};
