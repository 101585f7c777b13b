import { useCallback, useEffect, useState } from "react";
import { discardFinding } from "../model/finding-queue";
import type { LocalFinding } from "../model/local-types";
import { walkDb } from "../model/walk-db";
import { refreshCounts, subscribeSync } from "./sync-loop";

/** The sweep's pinpointed leaks still on this device (waiting, or refused with reasons). */
export function useQueuedFindings(sweepId: string) {
  const [list, setList] = useState<LocalFinding[]>([]);
  const load = useCallback(async () => {
    const db = await walkDb();
    setList((await db.getAll("findings")).filter((f) => f.sweepId === sweepId));
  }, [sweepId]);
  // Read again whenever the queue's counts change (a finding queued, uploaded or refused).
  useEffect(() => {
    let last = "";
    return subscribeSync((s) => {
      const key = `${s.waiting}/${s.rejected}`;
      if (key === last) return;
      last = key;
      void load();
    });
  }, [load]);
  const discard = useCallback(
    async (clientId: string) => {
      await discardFinding(await walkDb(), clientId);
      await load();
      await refreshCounts();
    },
    [load],
  );
  return { list, discard };
}
