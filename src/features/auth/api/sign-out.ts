import { useMutation, useQueryClient } from "@tanstack/react-query";
import { sessionInfo, type SessionInfo } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";
import { replaceSession } from "./session-cache";

export function signOut(): Promise<SessionInfo> {
  return api.post("/api/auth/sign-out", sessionInfo);
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: (info) => replaceSession(queryClient, info),
  });
}
