import type { CreateSweepInput, ReadingInput, ReadingEditInput, ReadingsBatchResult } from "../../../../server/contracts/sweeps";

/** What the sync queue needs from the server (the real one is api/sync-api.ts). */
export interface SyncTransport {
  createSweep(storeId: string, body: CreateSweepInput): Promise<void>;
  uploadReadings(sweepId: string, readings: ReadingInput[]): Promise<ReadingsBatchResult>;
  editReading(sweepId: string, readingId: string, body: ReadingEditInput): Promise<void>;
  deleteReading(sweepId: string, readingId: string, editedAt: string | null): Promise<void>;
  submitSweep(sweepId: string): Promise<void>;
}

/** A failure the server gave a reason for (4xx), as opposed to a lost connection or a 5xx. */
export class RefusedError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string>,
  ) {
    super(message);
  }
}
