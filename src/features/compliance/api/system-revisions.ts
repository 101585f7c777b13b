import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { system, systemRevisionList, type revisionInput } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";
import { invalidateEntity } from "../../../entities/invalidate";

export function getSystemRevisions(systemId: string, signal?: AbortSignal) {
  return api.get(`/api/systems/${systemId}/revisions`, systemRevisionList, signal);
}

export function systemRevisionsQueryOptions(systemId: string) {
  return queryOptions({
    queryKey: complianceKeys.revisions(systemId),
    queryFn: ({ signal }) => getSystemRevisions(systemId, signal),
  });
}

export function useSystemRevisions(systemId: string) {
  return useQuery(systemRevisionsQueryOptions(systemId));
}

/** A dated revision (engineers and owners); every figure of the records is read again. */
export function addSystemRevision({ systemId, input }: { systemId: string; input: z.input<typeof revisionInput> }) {
  return api.post(`/api/systems/${systemId}/revisions`, system, input);
}

export function useAddSystemRevision(options: { onDone?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addSystemRevision,
    onSuccess: (_system, { systemId }) => {
      void queryClient.invalidateQueries({ queryKey: complianceKeys.revisions(systemId) });
      // A revision changes the system and every figure derived from it (Today, its records).
      void invalidateEntity(queryClient, "system");
      options.onDone?.();
    },
  });
}
