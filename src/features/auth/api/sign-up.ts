import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { sessionInfo, type SessionInfo } from "#core/contracts/auth";
import { signUpInput, type SignUpInput } from "#core/contracts/signup";
import { api } from "../../../lib/api-client";
import { replaceSession } from "./session-cache";

const accepted = z.object({ ok: z.literal(true) });

export function signUp(input: SignUpInput) {
  return api.post("/api/signup", accepted, input);
}

export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}

export function confirmSignUp(token: string): Promise<SessionInfo> {
  return api.post("/api/signup/confirm", sessionInfo, { token });
}

export function useConfirmSignUp() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: confirmSignUp, onSuccess: (info) => replaceSession(queryClient, info) });
}

export { signUpInput };
