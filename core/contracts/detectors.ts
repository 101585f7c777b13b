import { z } from "zod";
import { text } from "./text";
import { bounded, DETECTOR_SECONDS_MAX, PPM_PHYSICAL_MAX, PPM_STEP, SECONDS_STEP, stepped } from "./quantities";
import { levelScaleProblems } from "../domain/detectors/level-scale";

export const SENSING_PRINCIPLES = ["heated-diode", "infrared", "other"] as const;
export const PRINCIPLE_LABELS: Record<(typeof SENSING_PRINCIPLES)[number], string> = {
  "heated-diode": "Heated diode / heated ceramic",
  infrared: "Infrared (NDIR)",
  other: "Other",
};

const levelBand = z
  .object({
    level: text().trim().min(1, "is required").max(20, "must be at most 20 characters"),
    minPpm: bounded("ppm", 0, PPM_PHYSICAL_MAX),
    maxPpm: bounded("ppm", 0, PPM_PHYSICAL_MAX, { aboveMin: true }).nullable(),
  })
  .refine((b) => b.maxPpm === null || b.maxPpm > b.minPpm, {
    path: ["maxPpm"],
    message: "must be above the lower bound",
  });

export const detectorInput = z.object({
  name: text().trim().min(1, "is required").max(80, "must be at most 80 characters"),
  principle: z.enum(SENSING_PRINCIPLES, "must be heated-diode, infrared or other"),
  // Defaults: 5 s transport delay and 2 ppm alarm are common practice for hose-sampling
  // detectors (no published source); set them from the instrument's manual.
  transportDelayS: stepped("s", 0, DETECTOR_SECONDS_MAX, SECONDS_STEP).default(5),
  timeConstantS: stepped("s", 0, DETECTOR_SECONDS_MAX, SECONDS_STEP).default(1.5),
  alarmPpm: z
    .number("must be a number of ppm")
    .finite("must be a finite number of ppm")
    .transform((v) => Math.round(v / PPM_STEP) * PPM_STEP)
    .pipe(bounded("ppm", PPM_STEP, 10_000))
    .default(2),
  lastCheckedOn: z.iso.date("must be a date (YYYY-MM-DD)").nullable().default(null),
  levelScale: z
    .array(levelBand)
    .max(20, "must have at most 20 levels")
    .superRefine((bands, ctx) => {
      for (const [path, message] of Object.entries(levelScaleProblems(bands))) {
        const [i, field] = path.split(".");
        ctx.addIssue({ code: "custom", path: [Number(i), field], message });
      }
    })
    .nullable()
    .default(null),
});
export type DetectorInput = z.infer<typeof detectorInput>;

export const detector = detectorInput.extend({
  id: z.uuid(),
  archivedAt: text().nullable(),
  /** Date the next calibration / bump check falls due, from the company's interval. */
  checkDueOn: text().nullable(),
  overdue: z.boolean(),
});
export type Detector = z.infer<typeof detector>;
