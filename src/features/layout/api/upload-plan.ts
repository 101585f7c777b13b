import { useMutation, useQueryClient } from "@tanstack/react-query";
import { plan } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";
import { plansKeys } from "../../../entities/plans/plans-keys";

/** The server checks the content (magic bytes, pixel budget, a full decode); these only catch the obvious early. */
export const PLAN_IMAGE_TYPES = ["image/png", "image/jpeg"] as const;

/** Uploads a PNG or JPEG drawing. A store that has a plan gets a new version, with its fixtures carried over. */
export function uploadPlan({ storeId, file }: { storeId: string; file: File }) {
  const form = new FormData();
  form.append("image", file);
  return api.upload(`/api/stores/${storeId}/plans`, plan, form);
}

export function useUploadPlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadPlan,
    onSuccess: (saved) => {
      queryClient.setQueryData(plansKeys.detail(saved.id), saved);
      return invalidateEntity(queryClient, "plan");
    },
  });
}
