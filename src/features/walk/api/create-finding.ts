import { finding, type CreateFindingInput } from "#core/contracts/findings";
import { apiErrorSchema } from "#core/contracts/common";
import { api, ApiRequestError, currentCsrfToken } from "../../../lib/api-client";

// The two calls behind a queued "Leak here" (model/finding-queue.ts sends them).

/** Creates the finding; with a clientId already stored, the server answers with that finding. */
export async function postWalkFinding(
  storeId: string,
  input: CreateFindingInput,
): Promise<{ id: string; photoCount: number }> {
  const f = await api.post(`/api/stores/${storeId}/findings`, finding, input);
  return { id: f.id, photoCount: f.photos.length };
}

export async function postFindingPhoto(
  findingId: string,
  photo: { name: string; type: string; data: ArrayBuffer },
): Promise<void> {
  const form = new FormData();
  form.append("photo", new Blob([photo.data], { type: photo.type }), photo.name);
  let res: Response;
  try {
    res = await fetch(`/api/findings/${findingId}/photos`, {
      method: "POST",
      body: form,
      credentials: "same-origin",
      headers: { Accept: "application/json", ...(currentCsrfToken() ? { "X-CSRF-Token": currentCsrfToken()! } : {}) },
    });
  } catch (e) {
    throw new Error(
      `The photo could not be sent (${e instanceof Error ? e.message : String(e)}); it stays on this device.`,
    );
  }
  if (!res.ok) {
    const body = apiErrorSchema.safeParse(await res.json().catch(() => null));
    const message = body.success
      ? `The finding was saved, but its photo was not: ${body.data.error.message}`
      : "The finding was saved, but its photo could not be uploaded.";
    throw new ApiRequestError(
      res.status,
      body.success ? body.data.error.code : "photo_failed",
      message,
      body.success ? { photo: body.data.error.message } : {},
    );
  }
}
