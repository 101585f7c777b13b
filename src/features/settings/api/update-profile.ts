import { useMutation } from "@tanstack/react-query";
import { profileUpdateInput, sessionInfo, type ProfileUpdateInput, type SessionInfo } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";

export { profileUpdateInput };

export function updateProfile(input: ProfileUpdateInput): Promise<SessionInfo> {
  return api.patch("/api/profile", sessionInfo, input);
}

/** The answer is a SessionInfo; the route writes it into the session cache (auth's key). */
export function useUpdateProfile(options: { onSaved?: (info: SessionInfo) => void } = {}) {
  return useMutation({ mutationFn: updateProfile, onSuccess: (info) => options.onSaved?.(info) });
}
