import { z } from "zod";
import { text } from "./text";
import { PLAN_COORD_MAX_M } from "./quantities";

// A finding is a leak record: suspected → confirmed → repaired → verified → closed, or dismissed; one still
// open when its system is retired is closed as "left service" (docs/decisions/0166).
// The Walk screen creates one at a pinpointed leak, the field map from a suspect spot, anyone by hand.
export const FINDING_STATUSES = ["suspected", "confirmed", "repaired", "verified", "closed", "dismissed"] as const;
export const FINDING_COMPONENTS = ["brazed-joint", "flare", "valve", "coil", "gasket", "fitting", "other"] as const;
export const FINDING_SOURCES = ["walk", "suspect-spot", "manual"] as const;
export const DISMISS_REASONS = ["benign-source", "no-leak-found", "other"] as const;
/** What a step in a finding's history did (its status after the step is a separate field). */
export const FINDING_EVENT_KINDS = [
  "found",
  "confirmed",
  "repaired",
  "initial-test",
  "follow-up-test",
  "closed",
  "closed-left-service",
  "dismissed",
] as const;
export const FINDING_EVENT_LABELS: Record<(typeof FINDING_EVENT_KINDS)[number], string> = {
  found: "Found",
  confirmed: "Confirmed",
  repaired: "Repaired",
  "initial-test": "Initial verification test",
  "follow-up-test": "Follow-up verification test",
  closed: "Closed",
  "closed-left-service": "Closed: the system left service",
  dismissed: "Dismissed",
};

export const COMPONENT_LABELS: Record<(typeof FINDING_COMPONENTS)[number], string> = {
  "brazed-joint": "Brazed joint",
  flare: "Flare fitting",
  valve: "Valve",
  coil: "Coil",
  gasket: "Gasket / seal",
  fitting: "Other fitting",
  other: "Other",
};

const finite = (what: string) =>
  z
    .number(`${what} must be a number`)
    .finite(`${what} must be a finite number`)
    .min(-PLAN_COORD_MAX_M, `${what} must be at least -${PLAN_COORD_MAX_M} m`)
    .max(PLAN_COORD_MAX_M, `${what} must be at most ${PLAN_COORD_MAX_M} m`);

/** Create a finding. `clientId` (made on the device) makes an offline retry store it once. */
export const createFindingInput = z
  .object({
    clientId: z.uuid("must be a valid id").optional(),
    source: z.enum(FINDING_SOURCES).default("manual"),
    status: z.enum(["suspected", "confirmed"]).default("suspected"),
    systemId: z.uuid("must be a valid id").nullable().default(null),
    planId: z.uuid("must be a valid id").nullable().default(null),
    sweepId: z.uuid("must be a valid id").nullable().default(null),
    fixtureId: z.uuid("must be a valid id").nullable().default(null),
    /** Position on the plan in metres (plan coordinates); both or neither. */
    x: finite("x").nullable().default(null),
    y: finite("y").nullable().default(null),
    component: z.enum(FINDING_COMPONENTS).nullable().default(null),
    note: text().trim().max(2000, "must be at most 2,000 characters").default(""),
    /** When the leak was found (ISO instant); defaults to now on the server. */
    foundAt: z.iso.datetime({ offset: true, message: "must be a date and time" }).optional(),
  })
  .refine((v) => (v.x === null) === (v.y === null), { path: ["y"], message: "x and y must be given together" });
export type CreateFindingInput = z.input<typeof createFindingInput>;

export const findingPhoto = z.object({
  id: z.uuid(),
  url: text(),
  thumbUrl: text(),
  takenAt: text(),
  by: text(),
});

export const findingEvent = z.object({
  id: z.uuid(),
  status: z.enum(FINDING_STATUSES),
  /** The day it happened, in the store's time zone (YYYY-MM-DD). */
  on: text(),
  at: text(),
  by: text(),
  note: text(),
});

export const finding = z.object({
  id: z.uuid(),
  storeId: z.uuid(),
  systemId: z.uuid().nullable(),
  planId: z.uuid().nullable(),
  sweepId: z.uuid().nullable(),
  fixtureId: z.uuid().nullable(),
  x: z.number().nullable(),
  y: z.number().nullable(),
  component: z.enum(FINDING_COMPONENTS).nullable(),
  source: z.enum(FINDING_SOURCES),
  status: z.enum(FINDING_STATUSES),
  note: text(),
  foundAt: text(),
  foundBy: text(),
  events: z.array(findingEvent),
  photos: z.array(findingPhoto),
});
export type Finding = z.infer<typeof finding>;
