import { useMutation, useQueryClient } from "@tanstack/react-query";
import { plan } from "#core/contracts/plans";
import { uploadWithProgress, type UploadProgress } from "../../../lib/upload-with-progress";
import { invalidateEntity } from "../../../entities/invalidate";
import { plansKeys } from "../../../entities/plans/plans-keys";

/** The server checks the content (magic bytes, pixel budget, a full decode); these only catch the obvious early. */
export const PLAN_IMAGE_TYPES = ["image/png", "image/jpeg"] as const;

/**
 * Uploads a PNG or JPEG drawing, reporting how far it has gone. A store that has a plan gets a
 * new version, with its fixtures carried over.
 */
export function uploadPlan({
  storeId,
  file,
  onProgress,
}: {
  storeId: string;
  file: File;
  onProgress: (progress: UploadProgress) => void;
}) {
  const form = new FormData();
  form.append("image", file);
  return uploadWithProgress(`/api/stores/${storeId}/plans`, plan, form, onProgress);
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
