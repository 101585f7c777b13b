import { queryOptions, useQuery, type QueryClient } from "@tanstack/react-query";
import type { Detector } from "#core/contracts/detectors";
import type { StoreDetailResponse } from "#core/contracts/list-responses";
import type { FixturesResponse, Plan } from "#core/contracts/plans";
import type { Store } from "#core/contracts/stores";
import type { System } from "#core/contracts/systems";
import { detectorsQueryOptions } from "../../../entities/detectors/detectors-api";
import { planFixturesQueryOptions, planQueryOptions } from "../../../entities/plans/plans-api";
import { storeDetailQueryOptions } from "../../../entities/stores/stores-api";
import { walkDb } from "../model/walk-db";
import { walkKeys } from "./walk-keys";

// The Walk screen's device copy: the same entity queries the other screens read (so one fetch
// serves both), saved in IndexedDB so a sweep can start and run without a connection.

/** Everything a sweep of a store needs, kept on the device so a sweep can start offline. */
export interface StorePack {
  store: Store;
  systems: System[];
  detectors: Detector[];
  currentPlan: Plan | null;
  planVersions: StoreDetailResponse["planVersions"];
  savedAt: string;
  fromCache: boolean;
}

export interface PlanPack {
  plan: Plan;
  fixtures: FixturesResponse["fixtures"];
  image: Blob | null;
}

async function put(key: string, value: unknown) {
  await (await walkDb()).put("cache", { key, value, savedAt: new Date().toISOString() });
}
async function read<T>(key: string): Promise<T | undefined> {
  return (await (await walkDb()).get("cache", key))?.value as T | undefined;
}

/** Fetches a plan version with its fixtures and display image, and keeps a copy on the device. */
export async function fetchPlanPack(queryClient: QueryClient, planId: string): Promise<PlanPack> {
  const [p, f] = await Promise.all([
    queryClient.fetchQuery(planQueryOptions(planId)),
    queryClient.fetchQuery(planFixturesQueryOptions(planId)),
  ]);
  let image: Blob | null = null;
  if (p.image) {
    const res = await fetch(p.image.displayUrl, { credentials: "same-origin" });
    if (res.ok) image = await res.blob();
  }
  const pack = { plan: p, fixtures: f.fixtures, image };
  await put(`plan:${planId}`, pack);
  return pack;
}

/** The store's pack from the server (cached as a side effect), or the device's copy when offline. */
export async function loadStorePack(queryClient: QueryClient, storeId: string): Promise<StorePack> {
  try {
    // No retry here: without a connection the device's copy answers at once instead of after a retry's wait.
    const [detail, detectors] = await Promise.all([
      queryClient.fetchQuery({ ...storeDetailQueryOptions(storeId), retry: false }),
      queryClient.fetchQuery({ ...detectorsQueryOptions(false), retry: false }),
    ]);
    const pack: StorePack = { ...detail, detectors, savedAt: new Date().toISOString(), fromCache: false };
    await put(`store:${storeId}`, pack);
    if (detail.currentPlan?.calibrated) await fetchPlanPack(queryClient, detail.currentPlan.id);
    return pack;
  } catch (e) {
    const cached = await read<StorePack>(`store:${storeId}`);
    if (cached) return { ...cached, fromCache: true };
    throw e;
  }
}

/** The plan from the device first (it is what the sweep was started on), then the server. */
export async function loadPlanPack(queryClient: QueryClient, planId: string): Promise<PlanPack> {
  const cached = await read<PlanPack>(`plan:${planId}`);
  if (cached) return cached;
  return fetchPlanPack(queryClient, planId);
}

export function storePackQueryOptions(storeId: string) {
  return queryOptions({
    queryKey: walkKeys.storePack(storeId),
    queryFn: ({ client }) => loadStorePack(client, storeId),
    retry: false,
    staleTime: 60_000,
    // It answers from the device when the server cannot: never paused for want of a connection.
    networkMode: "always",
  });
}

export function useStorePack(storeId: string | undefined) {
  return useQuery({ ...storePackQueryOptions(storeId ?? ""), enabled: !!storeId });
}

export function usePlanPack(planId: string | undefined) {
  return useQuery({
    queryKey: walkKeys.planPack(planId ?? ""),
    queryFn: ({ client }) => loadPlanPack(client, planId!),
    enabled: !!planId,
    retry: false,
    networkMode: "always",
    staleTime: Infinity,
  });
}
