// Query keys of the auth feature, general to specific. Company switches keep only these.
export const authKeys = {
  all: ["auth"] as const,
  session: () => [...authKeys.all, "session"] as const,
  invitations: () => [...authKeys.all, "invitations"] as const,
  invitation: (token: string) => [...authKeys.invitations(), token] as const,
};
