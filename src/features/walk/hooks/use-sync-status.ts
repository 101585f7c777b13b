import { useEffect, useState } from "react";
import { currentSyncStatus, subscribeSync, type SyncStatus } from "./sync-loop";

export function useSyncStatus(): SyncStatus {
  const [s, setS] = useState(currentSyncStatus);
  useEffect(() => subscribeSync(setS), []);
  return s;
}
