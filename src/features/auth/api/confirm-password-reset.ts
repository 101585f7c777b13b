import { useMutation } from "@tanstack/react-query";
import type { z } from "zod";
import { passwordResetConfirmInput } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";

export { passwordResetConfirmInput };

export function confirmPasswordReset(input: z.infer<typeof passwordResetConfirmInput>): Promise<void> {
  return api.post("/api/auth/password-reset/confirm", null, input);
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
