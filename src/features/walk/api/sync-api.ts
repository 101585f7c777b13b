import {
  readingsBatchResult,
  type CreateSweepInput,
  type ReadingEditInput,
  type ReadingInput,
  type SweepPassInput,
} from "#core/contracts/sweeps";
import { api, isApiRequestError } from "../../../lib/api-client";
import { RefusedError, type SyncTransport } from "../model/sync-transport";
import { postFindingPhoto, postWalkFinding } from "./create-finding";

/** A 4xx with a reason is a refusal the data must be fixed for; anything else is retried later. */
async function call<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (e) {
    if (isApiRequestError(e) && e.status >= 400 && e.status < 500)
      throw new RefusedError(e.status, e.message, e.fields);
    throw e;
  }
}

export const httpSyncTransport: SyncTransport = {
  async createSweep(storeId: string, body: CreateSweepInput) {
    await call(() => api.post(`/api/stores/${storeId}/sweeps`, null, body));
  },
  uploadReadings(sweepId: string, readings: ReadingInput[]) {
    return call(() => api.post(`/api/sweeps/${sweepId}/readings`, readingsBatchResult, { readings }));
  },
  async savePass(sweepId: string, passId: string, body: SweepPassInput) {
    await call(() => api.put(`/api/sweeps/${sweepId}/passes/${passId}`, null, body));
  },
  async editReading(sweepId: string, readingId: string, body: ReadingEditInput) {
    await call(() => api.patch(`/api/sweeps/${sweepId}/readings/${readingId}`, null, body));
  },
  async deleteReading(sweepId: string, readingId: string, editedAt: string | null) {
    const q = editedAt ? `?editedAt=${encodeURIComponent(editedAt)}` : "";
    await call(() => api.delete(`/api/sweeps/${sweepId}/readings/${readingId}${q}`));
  },
  async submitSweep(sweepId: string) {
    await call(() => api.post(`/api/sweeps/${sweepId}/submit`, null));
  },
  createFinding(storeId, input) {
    return call(() => postWalkFinding(storeId, input));
  },
  async addFindingPhoto(findingId, photo) {
    await call(() => postFindingPhoto(findingId, photo));
  },
};
