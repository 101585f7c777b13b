import type { CreateFindingInput } from "#core/contracts/findings";
import type { SamplePoint, SweepWarning } from "#core/contracts/sweeps";
import type { ReadingSync } from "./reading-sync";
import type { SweepSync } from "./sweep-sync";

/** A sweep as the device holds it; `sync` says what the server has of it. */
export interface LocalSweep {
  id: string;
  storeId: string;
  planId: string;
  detectorId: string;
  detectorName: string;
  systemIds: string[];
  fans: "running" | "stopped";
  defrost: boolean;
  startedAt: string;
  status: "in-progress" | "submitted" | "reviewed";
  transportDelayS: number;
  timeConstantS: number;
  alarmPpm: number;
  warnings: SweepWarning[];
  sync: SweepSync;
  /** Pinpoint passes in order of start (the sweep's own fans/defrost are the first pass). */
  passes: LocalPass[];
}

/**
 * A pinpoint pass as the device holds it: the air it is walked in, and when the technician wants to be
 * told to restore the fans. Written here first, like a reading; `sync` says whether the server has it
 * (its start, and its end once ended).
 */
export interface LocalPass {
  id: string;
  fans: "running" | "stopped";
  defrost: boolean;
  /** The fixture whose fans were stopped or which is in defrost; null = the whole store. */
  fixtureId: string | null;
  startedAt: string;
  endedAt: string | null;
  /** Minutes after the start at which the screen asks for the fans to be restored. */
  restoreAfterMin: number;
  sync: { kind: "queued" } | { kind: "on-server" } | { kind: "refused"; reasons: Record<string, string> };
}

/** A reading as the device holds it. It is written here FIRST, before any upload. */
export interface LocalReading {
  id: string;
  sweepId: string;
  /** Local order of taps (a monotonically increasing counter per device). */
  seq: number;
  x: number;
  y: number;
  takenAt: string;
  ppm: number;
  atLeast: boolean;
  samplePoint: SamplePoint;
  note: string;
  /** The pinpoint pass it was taken in; null (or absent, in rows made in code) = the first pass. */
  passId?: string | null;
  sync: ReadingSync;
}

export type ReadingValues = Pick<LocalReading, "x" | "y" | "takenAt" | "ppm" | "atLeast" | "samplePoint" | "note">;

/**
 * A pinpointed leak ("Leak here") as the device holds it until the server has it and its photo.
 * Keyed by the finding's client id, which makes a resent create store it once.
 */
export interface LocalFinding {
  clientId: string;
  storeId: string;
  sweepId: string;
  input: CreateFindingInput & { clientId: string };
  /** The photo's bytes (an ArrayBuffer clones into IndexedDB everywhere; a File may not). */
  photo: { name: string; type: string; data: ArrayBuffer } | null;
  state: "pending" | "rejected";
  /** The server's id once the finding is stored (the photo may still be waiting). */
  findingId: string | null;
  reasons: Record<string, string> | null;
}
