import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  chargeAdditionInput,
  chargeAdditionResponse,
  chargeCorrectionInput,
  chargeVoidInput,
  chronicReportInput,
  leakCheckInput,
  systemRecords,
} from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

type Action =
  | { kind: "add"; systemId: string; input: z.input<typeof chargeAdditionInput> }
  | { kind: "correct"; additionId: string; input: z.input<typeof chargeCorrectionInput> }
  | { kind: "void"; additionId: string; input: z.input<typeof chargeVoidInput> }
  | { kind: "leak-check"; systemId: string; input: z.input<typeof leakCheckInput> }
  | { kind: "chronic-report"; systemId: string; input: z.input<typeof chronicReportInput> };

/** Every change to a system's records answers with the fresh records (the leak rate moves at once). */
export async function recordCharge(action: Action) {
  switch (action.kind) {
    case "add":
      return (await api.post(`/api/systems/${action.systemId}/charge-additions`, chargeAdditionResponse, action.input))
        .records;
    case "correct":
      return (
        await api.post(`/api/charge-additions/${action.additionId}/corrections`, chargeAdditionResponse, action.input)
      ).records;
    case "void":
      return api.post(`/api/charge-additions/${action.additionId}/void`, systemRecords, action.input);
    case "leak-check":
      return api.post(`/api/systems/${action.systemId}/leak-checks`, systemRecords, action.input);
    case "chronic-report":
      return api.post(`/api/systems/${action.systemId}/chronic-reports`, systemRecords, action.input);
  }
}

export function useRecordCharge(options: { onDone?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordCharge,
    onSuccess: (records) => {
      queryClient.setQueryData(complianceKeys.record(records.system.id), records);
      void queryClient.invalidateQueries({ queryKey: complianceKeys.all });
      options.onDone?.();
    },
  });
}
