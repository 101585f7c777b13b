import { useMutation, useQueryClient } from "@tanstack/react-query";
import { system, type SystemUpdateInput } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { systemsKeys } from "./systems-keys";

export function updateSystem({ id, input }: { id: string; input: SystemUpdateInput }) {
  return api.patch(`/api/systems/${id}`, system, input);
}

export function useUpdateSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSystem,
    onSuccess: (saved) => queryClient.invalidateQueries({ queryKey: systemsKeys.list(saved.storeId) }),
  });
}
