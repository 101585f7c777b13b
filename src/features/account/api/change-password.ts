import { useMutation, useQueryClient } from "@tanstack/react-query";
import { passwordChangeInput, type PasswordChangeInput } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./account-keys";

export { passwordChangeInput };

/** A new password ends every other session of yours (the server does it); the list is read again. */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PasswordChangeInput) => api.post("/api/profile/password", null, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }),
  });
}
