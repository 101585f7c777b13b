import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  companyRefrigerantList,
  companyRefrigerantView,
  type CompanyRefrigerantInput,
} from "#core/contracts/company-refrigerants";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";
import { companyRefrigerantKeys, refrigerantKeys } from "./systems-keys";

/** The company's own refrigerants, retired ones too, with how many systems name each. */
export async function getCompanyRefrigerants(signal?: AbortSignal) {
  return (await api.get("/api/company-refrigerants", companyRefrigerantList, signal)).refrigerants;
}

export function useCompanyRefrigerants() {
  return useQuery(
    queryOptions({ queryKey: companyRefrigerantKeys.all, queryFn: ({ signal }) => getCompanyRefrigerants(signal) }),
  );
}

/** A new one, a retirement or a deletion changes the picker, the list, and what systems show. */
function useRefresh() {
  const queryClient = useQueryClient();
  return async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: companyRefrigerantKeys.all }),
      queryClient.invalidateQueries({ queryKey: refrigerantKeys.all }),
      invalidateEntity(queryClient, "system"),
    ]);
  };
}

export function useCreateCompanyRefrigerant() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (input: CompanyRefrigerantInput) =>
      api.post("/api/company-refrigerants", companyRefrigerantView, input),
    onSuccess: refresh,
  });
}

export function useSetCompanyRefrigerantRetired() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: ({ rowId, retired }: { rowId: string; retired: boolean }) =>
      api.patch(`/api/company-refrigerants/${rowId}`, companyRefrigerantView, { retired }),
    onSuccess: refresh,
  });
}

export function useDeleteCompanyRefrigerant() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: ({ rowId }: { rowId: string }) => api.delete(`/api/company-refrigerants/${rowId}`),
    onSuccess: refresh,
  });
}
