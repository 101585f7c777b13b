import type { Sweep } from "#core/contracts/sweeps";
import type { LocalSweep } from "./local-types";
import { submitQueued, sweepOnServer } from "./sweep-sync";

/** A sweep this device holds, with what its readings count. */
export interface LocalSweepSummary {
  sweep: LocalSweep;
  /** Readings in the sweep as shown (deleted ones left out). */
  readings: number;
  /** Readings not on the server yet: queued, or still open on the keypad. */
  waiting: number;
}

/** One line of the "resume a sweep" list. */
export interface ResumeEntry {
  sweepId: string;
  storeId: string;
  startedAt: string;
  /** Null when the sweep is only on this device (started here by whoever is signed in). */
  technicianName: string | null;
  own: boolean;
  readings: number;
  waiting: number;
  /** The server does not have the sweep yet. */
  onlyOnDevice: boolean;
}

/**
 * The sweeps a technician can resume: those on this device that are still in progress, and those
 * the server lists as in progress, merged by id; the member's own first, then the newest.
 * `server` is null when the server could not be asked (offline): the device's list stands alone.
 * A sweep whose submit waits on this device is done as far as the technician is concerned.
 */
export function resumeList(
  local: readonly LocalSweepSummary[],
  server: readonly Sweep[] | null,
  userId: string,
  storeId?: string,
): ResumeEntry[] {
  const byId = new Map<string, ResumeEntry>();
  const finished = new Set<string>();
  for (const { sweep, readings, waiting } of local) {
    if (sweep.status !== "in-progress" || submitQueued(sweep.sync)) {
      finished.add(sweep.id);
      continue;
    }
    byId.set(sweep.id, {
      sweepId: sweep.id,
      storeId: sweep.storeId,
      startedAt: sweep.startedAt,
      technicianName: null,
      // Started or opened on this device by the one who uses it: counted as theirs until the server says.
      own: true,
      readings,
      waiting,
      onlyOnDevice: !sweepOnServer(sweep.sync),
    });
  }
  for (const s of server ?? []) {
    if (s.status !== "in-progress" || finished.has(s.id)) continue;
    const mine = byId.get(s.id);
    byId.set(s.id, {
      sweepId: s.id,
      storeId: s.storeId,
      startedAt: s.startedAt,
      technicianName: s.technicianName,
      own: s.technicianId === userId,
      // The device may hold readings the server has not had yet, and the server ones this device never pulled.
      readings: Math.max(s.readingCount, mine?.readings ?? 0),
      waiting: mine?.waiting ?? 0,
      onlyOnDevice: false,
    });
  }
  return [...byId.values()]
    .filter((e) => !storeId || e.storeId === storeId)
    .sort((a, b) => Number(b.own) - Number(a.own) || Date.parse(b.startedAt) - Date.parse(a.startedAt));
}
