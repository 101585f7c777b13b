import { z } from "zod";
import { detector } from "./detectors";
import { plan, planVersionSummary } from "./plans";
import { store } from "./stores";
import { reading, sweep } from "./sweeps";
import { system } from "./systems";

// Answers that wrap other contracts (lists, the store page), declared once for the server's
// routes and the client's entity fetchers (src/entities/).

/** GET /api/stores/:storeId/plans */
export const planListResponse = z.object({ plans: z.array(plan) });
/** GET /api/stores/:storeId/sweeps */
export const sweepListResponse = z.object({ sweeps: z.array(sweep) });
/** GET /api/sweeps/:id/readings */
export const readingListResponse = z.object({ readings: z.array(reading) });
/** GET /api/detectors */
export const detectorListResponse = z.object({ detectors: z.array(detector) });

/** GET /api/stores/:id: the store page with its systems, current plan and every plan version, newest first. */
export const storeDetailResponse = z.object({
  store,
  systems: z.array(system),
  currentPlan: plan.nullable(),
  planVersions: z.array(planVersionSummary),
});
export type StoreDetailResponse = z.infer<typeof storeDetailResponse>;
