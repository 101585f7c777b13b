/**
 * Where a sweep stands between this device and the server, as one union (the readings have theirs
 * in reading-sync.ts). A submit may be asked for before the sweep itself reached the server.
 */
export type SweepSync =
  /** Started on this device; the server does not have it yet. */
  | { kind: "queued-new"; thenSubmit: boolean }
  | { kind: "on-server" }
  /** On the server; the submit waits until every reading before it is uploaded. */
  | { kind: "queued-submit" }
  /** The server refused the sweep itself (e.g. its plan was removed): a reason per field. */
  | { kind: "refused"; reasons: Record<string, string>; thenSubmit: boolean };

export const SWEEP_QUEUED_NEW: SweepSync = { kind: "queued-new", thenSubmit: false };
export const SWEEP_ON_SERVER: SweepSync = { kind: "on-server" };

export function sweepOnServer(s: SweepSync): boolean {
  return s.kind === "on-server" || s.kind === "queued-submit";
}

/** Something about the sweep itself waits for the server (its creation or its submit). */
export function sweepWaits(s: SweepSync): boolean {
  return s.kind === "queued-new" || s.kind === "queued-submit";
}

export function submitQueued(s: SweepSync): boolean {
  return s.kind === "queued-submit" || ((s.kind === "queued-new" || s.kind === "refused") && s.thenSubmit);
}

/** The technician pressed Submit. */
export function afterSubmitAsked(s: SweepSync): SweepSync {
  if (s.kind === "on-server" || s.kind === "queued-submit") return { kind: "queued-submit" };
  return { ...s, thenSubmit: true };
}

/** The server created the sweep (or already had it). */
export function afterSweepCreated(s: SweepSync): SweepSync {
  return submitQueued(s) ? { kind: "queued-submit" } : SWEEP_ON_SERVER;
}

export function afterSweepRefused(s: SweepSync, reasons: Record<string, string>): SweepSync {
  return { kind: "refused", reasons, thenSubmit: submitQueued(s) };
}

/** The flags sweeps carried before the union (walk database version 3 and earlier). */
export interface LegacySweepFlags {
  onServer?: boolean;
  submitPending?: boolean;
  rejected?: Record<string, string> | null;
}

export function sweepSyncFromLegacy(s: LegacySweepFlags): SweepSync {
  const thenSubmit = s.submitPending === true;
  if (s.rejected) return { kind: "refused", reasons: s.rejected, thenSubmit };
  if (!s.onServer) return { kind: "queued-new", thenSubmit };
  return thenSubmit ? { kind: "queued-submit" } : SWEEP_ON_SERVER;
}

/**
 * What the Walk screen's header says about the sweep: "submitted" only once the server has the
 * submit (the device sets that status when the server confirms it); until then, that it waits.
 */
export function sweepStateText(status: "in-progress" | "submitted" | "reviewed", s: SweepSync): string {
  if (status === "reviewed") return "reviewed";
  if (status === "submitted") return "submitted";
  if (submitQueued(s)) return "submit waits to upload";
  return "";
}
