import { useQuery } from "@tanstack/react-query";
import { storePackQueryOptions } from "../api/store-pack";

/**
 * Opening a store keeps its plan, fixtures, image, systems and detectors on this device, so a
 * sweep of it can start later without a connection. Runs quietly: failures only mean no copy.
 */
export function useKeepStoreOnDevice(storeId: string, enabled: boolean): void {
  useQuery({ ...storePackQueryOptions(storeId), enabled: enabled && !!storeId, staleTime: 5 * 60_000 });
}
