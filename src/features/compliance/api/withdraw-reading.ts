import { useMutation, useQueryClient } from "@tanstack/react-query";
import { readingsResponse, type WithdrawReadingInput } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

export function withdrawReading(input: WithdrawReadingInput) {
  return api.post("/api/compliance/readings/withdraw", readingsResponse, input);
}

/** The answer is the whole list again: the withdrawn reading reads as not accepted everywhere at once. */
export function useWithdrawReading() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawReading,
    onSuccess: (list) => queryClient.setQueryData(complianceKeys.readings(), list),
  });
}
