import { httpSyncTransport } from "../api/sync-api";
import { queueCounts } from "../model/reading-store";
import { syncOnce, type SyncReport } from "../model/sync-queue";
import { walkDb } from "../model/walk-db";

// One sync loop per tab: passes never overlap, run after every local change, when the browser
// says it is online again, and every few seconds while anything waits.

export interface SyncStatus {
  waiting: number;
  rejected: number;
  syncing: boolean;
  online: boolean;
  lastReport: SyncReport | null;
}

let status: SyncStatus = {
  waiting: 0,
  rejected: 0,
  syncing: false,
  online: typeof navigator === "undefined" ? true : navigator.onLine,
  lastReport: null,
};
const listeners = new Set<(s: SyncStatus) => void>();
let running: Promise<SyncReport> | null = null;
let again = false;
let timer: ReturnType<typeof setInterval> | null = null;

function publish(patch: Partial<SyncStatus>) {
  status = { ...status, ...patch };
  for (const l of listeners) l(status);
}

export async function refreshCounts(): Promise<void> {
  publish(await queueCounts(await walkDb()));
}

/** Runs a pass now (or right after the one in flight) and resolves with its report. */
export function syncNow(): Promise<SyncReport> {
  if (running) {
    again = true;
    return running;
  }
  running = (async () => {
    publish({ syncing: true });
    let report: SyncReport;
    try {
      const db = await walkDb();
      do {
        again = false;
        report = await syncOnce(db, httpSyncTransport);
      } while (again && !report.stoppedBy);
      publish({ lastReport: report });
      return report;
    } finally {
      running = null;
      publish({ syncing: false });
      await refreshCounts();
    }
  })();
  return running;
}

let soon: ReturnType<typeof setTimeout> | null = null;

/** A pass shortly after a burst of taps settles: one upload for a quick run of readings. */
export function syncSoon(delayMs = 300): void {
  if (soon) clearTimeout(soon);
  soon = setTimeout(() => {
    soon = null;
    void syncNow();
  }, delayMs);
}

export function subscribeSync(listener: (s: SyncStatus) => void): () => void {
  listeners.add(listener);
  listener(status);
  if (!timer && typeof window !== "undefined") {
    window.addEventListener("online", () => {
      publish({ online: true });
      void syncNow();
    });
    window.addEventListener("offline", () => publish({ online: false }));
    timer = setInterval(() => {
      if (status.waiting > 0 && !running) void syncNow();
    }, 4000);
    void refreshCounts().then(() => syncNow());
  }
  return () => listeners.delete(listener);
}

export function currentSyncStatus(): SyncStatus {
  return status;
}
