import { createContext, useContext } from "react";
import type { SessionInfo } from "#core/contracts/auth";
import type { Membership } from "../../features/auth/model/active-membership";

export interface SignedIn {
  session: SessionInfo;
  user: NonNullable<SessionInfo["user"]>;
  membership: Membership;
}

export const SignedInContext = createContext<SignedIn | null>(null);

/** For pages under RequireSession, which only renders them for a signed-in member. */
export function useSignedIn(): SignedIn {
  const value = useContext(SignedInContext);
  if (!value) throw new Error("useSignedIn is used outside RequireSession");
  return value;
}
