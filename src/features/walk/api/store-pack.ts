import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { detector, type Detector } from "#core/contracts/detectors";
import { fixturesResponse, plan, type FixturesResponse, type Plan } from "#core/contracts/plans";
import { store, type Store } from "#core/contracts/stores";
import { system, type System } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { walkDb } from "../model/walk-db";
import { walkKeys } from "./walk-keys";

const storeDetail = z.object({
  store,
  systems: z.array(system),
  currentPlan: plan.nullable(),
  planVersions: z.array(
    z.object({
      id: z.string(),
      version: z.number(),
      calibrated: z.boolean(),
      fixtureCount: z.number(),
      createdAt: z.string(),
    }),
  ),
});

/** Everything a sweep of a store needs, kept on the device so a sweep can start offline. */
export interface StorePack {
  store: Store;
  systems: System[];
  detectors: Detector[];
  currentPlan: Plan | null;
  planVersions: z.infer<typeof storeDetail>["planVersions"];
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
export async function fetchPlanPack(planId: string): Promise<PlanPack> {
  const p = await api.get(`/api/plans/${planId}`, plan);
  const f = await api.get(`/api/plans/${planId}/fixtures`, fixturesResponse);
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
export async function loadStorePack(storeId: string): Promise<StorePack> {
  try {
    const detail = await api.get(`/api/stores/${storeId}`, storeDetail);
    const detectors = (await api.get("/api/detectors", z.object({ detectors: z.array(detector) }))).detectors;
    const pack: StorePack = { ...detail, detectors, savedAt: new Date().toISOString(), fromCache: false };
    await put(`store:${storeId}`, pack);
    if (detail.currentPlan?.calibrated) await fetchPlanPack(detail.currentPlan.id);
    return pack;
  } catch (e) {
    const cached = await read<StorePack>(`store:${storeId}`);
    if (cached) return { ...cached, fromCache: true };
    throw e;
  }
}

/** The plan from the device first (it is what the sweep was started on), then the server. */
export async function loadPlanPack(planId: string): Promise<PlanPack> {
  const cached = await read<PlanPack>(`plan:${planId}`);
  if (cached) return cached;
  return fetchPlanPack(planId);
}

export function storePackQueryOptions(storeId: string) {
  return queryOptions({
    queryKey: walkKeys.storePack(storeId),
    queryFn: () => loadStorePack(storeId),
    retry: false,
    staleTime: 60_000,
  });
}

export function useStorePack(storeId: string | undefined) {
  return useQuery({ ...storePackQueryOptions(storeId ?? ""), enabled: !!storeId });
}

export function usePlanPack(planId: string | undefined) {
  return useQuery({
    queryKey: walkKeys.planPack(planId ?? ""),
    queryFn: () => loadPlanPack(planId!),
    enabled: !!planId,
    retry: false,
    staleTime: Infinity,
  });
}
