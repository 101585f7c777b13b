import { z } from "zod";
import { text } from "./text";

/** GET /api/stores/:storeId/sweep-summary: the store's last submitted sweeps, oldest first, for a plot. */
export const sweepSummaryItem = z.object({
  id: z.uuid(),
  startedAt: text(),
  technicianName: text(),
  readingCount: z.number(),
  /** The highest reading (ppm); null for a sweep without readings. */
  peakPpm: z.number().nullable(),
  /** The peak was a pegged display: the true value was at least `peakPpm`. */
  peakAtLeast: z.boolean(),
  /** Suspect spots of the analysis at the sweep's own settings; null until it has been analysed as it stands. */
  suspects: z.number().nullable(),
  /** Findings made from the sweep, and how many of them are confirmed or later (repaired, verified, closed). */
  findings: z.number(),
  confirmed: z.number(),
});
export type SweepSummaryItem = z.infer<typeof sweepSummaryItem>;

export const sweepSummaryResponse = z.object({ sweeps: z.array(sweepSummaryItem) });
