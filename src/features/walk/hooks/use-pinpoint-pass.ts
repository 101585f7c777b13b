import { useCallback, useEffect, useState } from "react";
import type { LocalSweep } from "../model/local-types";
import {
  endPass,
  openPass,
  restoreReminder,
  setRestoreMinutes,
  startPass,
  type PassStart,
} from "../model/pinpoint-pass";
import { getLocalSweep, saveSweep } from "../model/reading-store";
import { walkDb } from "../model/walk-db";
import { refreshCounts, syncSoon } from "./sync-loop";

/**
 * The pinpoint pass of a sweep: start, end and the restore reminder. Each change is written to the
 * device's sweep record first (so the pass and its reminder survive a reload), then the screen reads
 * the sweep again and the sync queue sends the pass.
 */
export function usePinpointPass(sweep: LocalSweep | null, reload: () => Promise<void>) {
  const change = useCallback(
    async (step: (s: LocalSweep) => LocalSweep) => {
      if (!sweep) return;
      const db = await walkDb();
      const now = await getLocalSweep(db, sweep.id);
      if (!now) return;
      await saveSweep(db, step({ ...now, passes: now.passes ?? [] }));
      await reload();
      void refreshCounts();
      syncSoon();
    },
    [sweep, reload],
  );
  const start = useCallback(
    (s: PassStart) => change((x) => startPass(x, s, crypto.randomUUID(), new Date().toISOString())),
    [change],
  );
  const end = useCallback(() => change((x) => endPass(x, new Date().toISOString())), [change]);
  const setMinutes = useCallback(
    (passId: string, min: number) => change((x) => setRestoreMinutes(x, passId, min)),
    [change],
  );
  const open = sweep ? openPass(sweep) : null;
  const nowMs = useClock(open !== null);
  const reminder = open ? restoreReminder(open, nowMs) : null;
  return { open, reminder, start, end, setMinutes };
}

/** The time, ticking every second while `running`. */
function useClock(running: boolean): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!running) return;
    setNow(Date.now());
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [running]);
  return now;
}
