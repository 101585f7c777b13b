import { z } from "zod";
import { text } from "./text";

export const fixtureTrendsQuery = z.object({
  /** The earlier and later sweep being compared; default the two latest. */
  a: z.uuid("must be a valid sweep id").optional(),
  b: z.uuid("must be a valid sweep id").optional(),
});

export const fixtureLevelSchema = z.object({ sweepId: z.uuid(), peakPpm: z.number(), meanPpm: z.number() });

export const fixtureTrendsResponse = z.object({
  sweeps: z.array(
    z.object({ id: z.uuid(), startedAt: text(), planId: z.uuid(), status: text(), technicianName: text() }),
  ),
  a: z.uuid().nullable(),
  b: z.uuid().nullable(),
  fixtures: z.array(
    z.object({
      id: z.uuid(),
      label: text(),
      kind: text(),
      /** One entry per sweep above, in the same order; null where the sweep did not sample it. */
      levels: z.array(fixtureLevelSchema.nullable()),
      /** Peak in b minus peak in a, ppm; null when either is unknown. */
      change: z.number().nullable(),
    }),
  ),
});
export type FixtureTrends = z.infer<typeof fixtureTrendsResponse>;
