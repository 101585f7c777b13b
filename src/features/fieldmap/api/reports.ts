import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { reportRecipient, reportSend, type SendReportInput } from "#core/contracts/reports";
import { sweep } from "#core/contracts/sweeps";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";
import { sweepsKeys } from "../../../entities/sweeps/sweeps-keys";
import { anyQueued, MAIL_REFRESH_MS } from "../../../components/mail-delivery-status";
import { fieldmapKeys } from "./fieldmap-keys";

export function useReportSends(sweepId: string) {
  return useQuery(
    queryOptions({
      queryKey: fieldmapKeys.sends(sweepId),
      queryFn: async ({ signal }) =>
        (await api.get(`/api/sweeps/${sweepId}/report/sends`, z.object({ sends: z.array(reportSend) }), signal)).sends,
      refetchInterval: (q) => (anyQueued(q.state.data) ? MAIL_REFRESH_MS : false),
    }),
  );
}

/** Puts a send whose e-mail failed back in the queue (same PDF, same recipients). */
export function useRetryReportSend(sweepId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (sendId: string) => api.post(`/api/sweeps/${sweepId}/report/sends/${sendId}/retry`, reportSend),
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldmapKeys.sends(sweepId) }),
  });
}

export function useReportRecipients(sweepId: string, enabled: boolean) {
  return useQuery({
    queryKey: fieldmapKeys.recipients(sweepId),
    queryFn: async ({ signal }) =>
      (
        await api.get(
          `/api/sweeps/${sweepId}/report/recipients`,
          z.object({ storeContacts: z.array(reportRecipient) }),
          signal,
        )
      ).storeContacts,
    enabled,
  });
}

export function useSendReport(sweepId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SendReportInput) => api.post(`/api/sweeps/${sweepId}/report/send`, reportSend, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldmapKeys.sends(sweepId) }),
  });
}

export function useReviewSweep(sweepId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post(`/api/sweeps/${sweepId}/review`, sweep),
    onSuccess: (s) => {
      qc.setQueryData(sweepsKeys.detail(sweepId), s);
      void invalidateEntity(qc, "sweep");
    },
  });
}
