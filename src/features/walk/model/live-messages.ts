import { z } from "zod";
import type { LiveEstimate, LiveProbe } from "#core/analysis/guide/live-guide";
import { SAMPLE_POINTS } from "#core/contracts/sweeps";

// The messages between the Walk screen and its live-guide worker. The screen sends the readings the
// device holds after each committed reading; the worker answers the estimate first, then the next probes.
// Requests carry a rising id: an answer to an older id than the last one sent is stale and dropped.

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const ring = z.array(z.tuple([finite, finite]));

export const liveRequestSchema = z.object({
  id: z.number().int().nonnegative(),
  plan: z.object({
    width: finite,
    height: finite,
    obstacles: z.array(z.object({ id: z.string(), polygon: ring })),
    fixtures: z.array(
      z.object({
        id: z.string(),
        kind: z.enum(["open-case", "island-case", "door-case", "walk-in", "machine-room"]),
        polygon: ring,
        fans: z.boolean(),
      }),
    ),
    riskPoints: z.array(
      z.object({ id: z.string(), kind: z.enum(["line-set", "valve", "coil"]), x: finite, y: finite }),
    ),
    backgroundZones: z.array(z.object({ id: z.string(), polygon: ring, note: z.string(), ppm: finite.optional() })),
  }),
  instrument: z.object({ transportDelayS: finite, timeConstantS: finite, alarmPpm: finite }),
  startedAt: z.iso.datetime({ offset: true }),
  readings: z.array(
    z.object({
      id: z.string(),
      x: finite,
      y: finite,
      takenAt: z.iso.datetime({ offset: true }),
      ppm: finite,
      atLeast: z.boolean(),
      samplePoint: z.enum(SAMPLE_POINTS),
      note: z.string(),
      /** The pinpoint pass it was taken in; null or absent: the first pass. */
      passId: z.string().nullable().optional(),
    }),
  ),
  /** The sweep's pinpoint passes (fans stopped, a defrost): each reading is fitted in its own air, as after submit. */
  passes: z
    .array(
      z.object({
        id: z.string(),
        fans: z.enum(["running", "stopped"]),
        defrost: z.boolean(),
        fixtureId: z.string().nullable(),
      }),
    )
    .optional(),
  /** Where the technician stands (the last reading's place), for the order of the next probes. */
  from: z.object({ x: finite, y: finite }).nullable(),
});

export type LiveRequest = z.infer<typeof liveRequestSchema>;

export type LiveReply =
  | { id: number; kind: "estimate"; estimate: LiveEstimate; ms: number }
  | { id: number; kind: "probes"; probes: LiveProbe[]; ms: number }
  /** The request could not be used: which field and why, or what went wrong; nothing else changes. */
  | { id: number; kind: "failed"; problems: string[] };
