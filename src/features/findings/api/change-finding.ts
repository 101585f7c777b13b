import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { findingActionInput, findingDetail } from "#core/contracts/finding-actions";
import { createFindingInput } from "#core/contracts/findings";
import { api, apiUpload } from "../../../lib/api-client";
import { findingsKeys } from "./findings-keys";

type Change =
  | { kind: "create"; storeId: string; input: z.input<typeof createFindingInput> }
  | { kind: "event"; findingId: string; input: z.input<typeof findingActionInput> }
  | { kind: "photo"; findingId: string; file: File };

export function changeFinding(change: Change) {
  switch (change.kind) {
    case "create":
      return api.post(`/api/stores/${change.storeId}/findings`, findingDetail, change.input);
    case "event":
      return api.post(`/api/findings/${change.findingId}/events`, findingDetail, change.input);
    case "photo": {
      const form = new FormData();
      form.append("photo", change.file);
      return apiUpload(`/api/findings/${change.findingId}/photos`, form, findingDetail);
    }
  }
}

/** Any change to a finding moves deadlines and the Today list, so those are refetched too. */
export function useChangeFinding(options: { onDone?: (id: string) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeFinding,
    onSuccess: (finding) => {
      queryClient.setQueryData(findingsKeys.detail(finding.id), finding);
      void queryClient.invalidateQueries({ queryKey: findingsKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: ["compliance"] });
      options.onDone?.(finding.id);
    },
  });
}
