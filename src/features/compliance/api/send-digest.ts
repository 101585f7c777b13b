import { useMutation } from "@tanstack/react-query";
import { digestSendResult } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";

export function sendDigestNow() {
  return api.post("/api/digest/send-now", digestSendResult);
}

export function useSendDigestNow() {
  return useMutation({ mutationFn: sendDigestNow });
}
