import { useQuery } from "@tanstack/react-query";
import type { Sweep } from "#core/contracts/sweeps";
import { getInProgressSweeps, getSweeps } from "../../../entities/sweeps/sweeps-api";
import { isApiRequestError } from "../../../lib/api-client";
import { sweepSummaries } from "../model/reading-store";
import { resumeList, type ResumeEntry } from "../model/resume-list";
import { walkDb } from "../model/walk-db";
import type { StorePack } from "./store-pack";
import { walkKeys } from "./walk-keys";

export interface ResumableSweep extends ResumeEntry {
  /** From the device's copy of the store, for sweeps the server list does not name. */
  storeName: string | null;
}

/**
 * Sweeps to resume: the device's own (read from IndexedDB, so the list works offline) merged with
 * the server's in-progress sweeps (GET /api/sweeps/in-progress, or one store's list).
 */
async function loadResumable(userId: string, storeId: string | null): Promise<ResumableSweep[]> {
  const db = await walkDb();
  const local = await sweepSummaries(db);
  let server: Sweep[] | null = null;
  try {
    server = storeId ? await getSweeps(storeId) : await getInProgressSweeps();
  } catch (e) {
    // Offline or the server is away: the device's sweeps still show. Anything else is an error to see.
    if (!(isApiRequestError(e) && (e.code === "network" || e.status >= 500))) throw e;
  }
  const entries = resumeList(local, server, userId, storeId ?? undefined);
  const names = new Map<string, string | null>();
  for (const e of entries)
    if (!names.has(e.storeId))
      names.set(
        e.storeId,
        ((await db.get("cache", `store:${e.storeId}`))?.value as StorePack | undefined)?.store.name ?? null,
      );
  return entries.map((e) => ({ ...e, storeName: names.get(e.storeId) ?? null }));
}

export function useResumableSweeps(userId: string, storeId: string | null, enabled = true) {
  return useQuery({
    queryKey: [...walkKeys.resumable(storeId), userId],
    queryFn: () => loadResumable(userId, storeId),
    enabled,
    retry: false,
    staleTime: 0,
    refetchOnMount: "always",
    // The device's list must show offline too: the query does not wait for a connection.
    networkMode: "always",
  });
}
