import type { CreateFindingInput } from "#core/contracts/findings";
import type {
  CreateSweepInput,
  ReadingInput,
  ReadingEditInput,
  ReadingsBatchResult,
  SweepPassInput,
} from "#core/contracts/sweeps";

/** What the sync queue needs from the server (the real one is api/sync-api.ts). */
export interface SyncTransport {
  createSweep(storeId: string, body: CreateSweepInput): Promise<void>;
  uploadReadings(sweepId: string, readings: ReadingInput[]): Promise<ReadingsBatchResult>;
  /** Idempotent by the pass id: starts the pass, or records its end. */
  savePass(sweepId: string, passId: string, body: SweepPassInput): Promise<void>;
  editReading(sweepId: string, readingId: string, body: ReadingEditInput): Promise<void>;
  deleteReading(sweepId: string, readingId: string, editedAt: string | null): Promise<void>;
  submitSweep(sweepId: string): Promise<void>;
  /** Idempotent by clientId: a resend answers with the finding already stored, photos included. */
  createFinding(storeId: string, input: CreateFindingInput): Promise<{ id: string; photoCount: number }>;
  addFindingPhoto(findingId: string, photo: { name: string; type: string; data: ArrayBuffer }): Promise<void>;
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
