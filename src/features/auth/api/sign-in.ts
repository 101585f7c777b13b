import { useMutation, useQueryClient } from "@tanstack/react-query";
import { sessionInfo, signInInput, type SignInInput, type SessionInfo } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";
import { replaceSession } from "./session-cache";

export { signInInput };

export function signIn(input: SignInInput): Promise<SessionInfo> {
  return api.post("/api/auth/sign-in", sessionInfo, input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (info) => replaceSession(queryClient, info),
  });
}
