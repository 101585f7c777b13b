import { z } from "zod";

export const fixtureTrendsQuery = z.object({
  /** The earlier and later sweep being compared; default the two latest. */
  a: z.uuid("must be a valid sweep id").optional(),
  b: z.uuid("must be a valid sweep id").optional(),
});

export const fixtureLevelSchema = z.object({ sweepId: z.uuid(), peakPpm: z.number(), meanPpm: z.number() });

export const fixtureTrendsResponse = z.object({
  sweeps: z.array(
    z.object({ id: z.uuid(), startedAt: z.string(), planId: z.uuid(), status: z.string(), technicianName: z.string() }),
  ),
  a: z.uuid().nullable(),
  b: z.uuid().nullable(),
  fixtures: z.array(
    z.object({
      id: z.uuid(),
      label: z.string(),
      kind: z.string(),
      /** One entry per sweep above, in the same order; null where the sweep did not sample it. */
      levels: z.array(fixtureLevelSchema.nullable()),
      /** Peak in b minus peak in a, ppm; null when either is unknown. */
      change: z.number().nullable(),
    }),
  ),
});
export type FixtureTrends = z.infer<typeof fixtureTrendsResponse>;
