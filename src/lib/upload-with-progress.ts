import type { z } from "zod";
import { ApiRequestError, currentCsrfToken, ensureCsrfToken, toError } from "./api-client";

/** Where a long upload is: sending its bytes (fraction sent, null when the size is unknown), or waiting for the server. */
export type UploadProgress = { stage: "uploading"; fraction: number | null } | { stage: "processing" };

/**
 * A multipart upload that reports its progress. fetch() cannot tell how far a request body has
 * gone; XMLHttpRequest's upload events can (WHATWG XMLHttpRequest Standard, "upload" and its
 * progress events). Same cookie, CSRF header and error shape as api.upload.
 */
export async function uploadWithProgress<T>(
  path: string,
  schema: z.ZodType<T>,
  form: FormData,
  onProgress: (progress: UploadProgress) => void,
): Promise<T> {
  await ensureCsrfToken();
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", path);
    xhr.setRequestHeader("Accept", "application/json");
    const token = currentCsrfToken();
    if (token) xhr.setRequestHeader("X-CSRF-Token", token);
    onProgress({ stage: "uploading", fraction: 0 });
    xhr.upload.onprogress = (e) =>
      onProgress({ stage: "uploading", fraction: e.lengthComputable ? e.loaded / e.total : null });
    // Every byte is sent: the server now checks, decodes and resizes the drawing.
    xhr.upload.onload = () => onProgress({ stage: "processing" });
    xhr.onerror = () =>
      reject(
        new ApiRequestError(0, "network", "Plumeline could not reach the server. Check the connection and try again."),
      );
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText === "" ? null : JSON.parse(xhr.responseText);
      } catch {
        body = undefined; // not JSON (a proxy's HTML error page, for instance)
      }
      if (xhr.status < 200 || xhr.status >= 300) return reject(toError(xhr.status, body));
      const parsed = schema.safeParse(body);
      if (!parsed.success)
        return reject(
          new ApiRequestError(
            xhr.status,
            "unexpected_response",
            `The server's answer to POST ${path} did not match the contract.`,
          ),
        );
      resolve(parsed.data);
    };
    xhr.send(form);
  });
}
