import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  chargeAdditionInput,
  chargeAdditionResponse,
  chargeCorrectionInput,
  chargeVoidInput,
  chronicReportInput,
  leakCheckInput,
  leakDetectionCheckInput,
  systemRecords,
} from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";
import { recordsKeys } from "../../../entities/records/records-keys";

type Action =
  | { kind: "add"; systemId: string; input: z.input<typeof chargeAdditionInput> }
  | { kind: "correct"; additionId: string; input: z.input<typeof chargeCorrectionInput> }
  | { kind: "void"; additionId: string; input: z.input<typeof chargeVoidInput> }
  | { kind: "leak-check"; systemId: string; input: z.input<typeof leakCheckInput> }
  | { kind: "leak-detection-check"; systemId: string; input: z.input<typeof leakDetectionCheckInput> }
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
    case "leak-detection-check":
      return api.post(`/api/systems/${action.systemId}/leak-detection-checks`, systemRecords, action.input);
    case "chronic-report":
      return api.post(`/api/systems/${action.systemId}/chronic-reports`, systemRecords, action.input);
  }
}

export function useRecordCharge(options: { onDone?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordCharge,
    onSuccess: (records) => {
      queryClient.setQueryData(recordsKeys.system(records.system.id), records);
      void invalidateEntity(queryClient, "charge");
      options.onDone?.();
    },
  });
}
