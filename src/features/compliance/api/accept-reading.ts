import { useMutation, useQueryClient } from "@tanstack/react-query";
import { readingsResponse, type AcceptReadingInput } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

export function acceptReading(input: AcceptReadingInput) {
  return api.post("/api/compliance/readings/accept", readingsResponse, input);
}

/** The answer is the whole list again, so it replaces the cached one. */
export function useAcceptReading() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptReading,
    onSuccess: (list) => queryClient.setQueryData(complianceKeys.readings(), list),
  });
}
