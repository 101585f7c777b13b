import { useMutation } from "@tanstack/react-query";
import { z } from "zod";
import { passwordResetRequestInput } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";

export { passwordResetRequestInput };

const accepted = z.object({ ok: z.literal(true) });

export function requestPasswordReset(input: z.infer<typeof passwordResetRequestInput>) {
  return api.post("/api/auth/password-reset", accepted, input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
