import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Fixture } from "#core/contracts/fixtures";
import { fixturesResponse } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";
import { fixturesKeys } from "../../../entities/plans/plans-keys";

/**
 * Replaces the plan's fixtures if nobody saved since `layoutRevision`; otherwise the server
 * answers 409 (code "conflict") and nothing changes.
 */
export function saveFixtures({
  planId,
  layoutRevision,
  fixtures,
}: {
  planId: string;
  layoutRevision: number;
  fixtures: readonly Fixture[];
}) {
  return api.put(`/api/plans/${planId}/fixtures`, fixturesResponse, { layoutRevision, fixtures });
}

export function useSaveFixtures() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveFixtures,
    onSuccess: (saved) => {
      queryClient.setQueryData(fixturesKeys.list(saved.planId), saved);
      return invalidateEntity(queryClient, "fixtures");
    },
  });
}
