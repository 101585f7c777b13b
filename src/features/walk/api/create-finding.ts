import { finding, type CreateFindingInput, type Finding } from "../../../../server/contracts/findings";
import { api, ApiRequestError, currentCsrfToken } from "../../../lib/api-client";
import { apiErrorSchema } from "../../../../server/contracts/common";

/** "Leak found here" → a finding (suspected or confirmed), then its photo. */
export async function createWalkFinding(storeId: string, input: CreateFindingInput, photo: File | null): Promise<Finding> {
  const created = await api.post(`/api/stores/${storeId}/findings`, finding, input);
  if (!photo) return created;
  const form = new FormData();
  form.append("photo", photo);
  const res = await fetch(`/api/findings/${created.id}/photos`, {
    method: "POST",
    body: form,
    credentials: "same-origin",
    headers: { Accept: "application/json", ...(currentCsrfToken() ? { "X-CSRF-Token": currentCsrfToken()! } : {}) },
  });
  if (!res.ok) {
    const body = apiErrorSchema.safeParse(await res.json().catch(() => null));
    throw new ApiRequestError(res.status, body.success ? body.data.error.code : "photo_failed", body.success ? `The finding was saved, but its photo was not: ${body.data.error.message}` : "The finding was saved, but its photo could not be uploaded.");
  }
  return created;
}
