import { createContext, useContext } from "react";

/**
 * Lets the sign-out button tell the route guard that the coming signed-out session is
 * deliberate, so the guard opens a plain sign-in page instead of one that returns to the
 * last page (which belongs to whoever signs in next).
 */
export interface SignOutIntent {
  begin: () => void;
  /** The sign-out failed: the person is still signed in. */
  cancel: () => void;
}

export const SignOutIntentContext = createContext<SignOutIntent>({ begin: () => {}, cancel: () => {} });

export function useSignOutIntent(): SignOutIntent {
  return useContext(SignOutIntentContext);
}
