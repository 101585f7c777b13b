import { z } from "zod";
import { text } from "./text";
import { DISMISS_REASONS, FINDING_COMPONENTS, FINDING_EVENT_KINDS, finding, findingEvent } from "./findings";

const isoDate = text({ error: "must be a date as YYYY-MM-DD" }).regex(
  /^\d{4}-\d{2}-\d{2}$/,
  "must be a date as YYYY-MM-DD",
);
const note = text({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default("");
/** The day on the store's calendar; defaults to the store's today. Never in the future. */
const on = isoDate.optional();
const result = z.enum(["passed", "failed"], { error: "must be passed or failed" });

/** One step of the lifecycle (POST /api/findings/:id/events). */
export const findingActionInput = z.discriminatedUnion(
  "action",
  [
    z.object({
      action: z.literal("confirm"),
      on,
      note,
      component: z.enum(FINDING_COMPONENTS, { error: `must be one of: ${FINDING_COMPONENTS.join(", ")}` }).optional(),
    }),
    z.object({ action: z.literal("repair"), on, note }),
    z.object({ action: z.literal("initial-test"), on, note, result }),
    z.object({ action: z.literal("follow-up-test"), on, note, result }),
    z.object({ action: z.literal("close"), on, note }),
    // The system was retired with the finding still open (docs/decisions/0166): dated on or after that day.
    z.object({ action: z.literal("close-left-service"), on, note }),
    z.object({
      action: z.literal("dismiss"),
      on,
      note,
      reason: z.enum(DISMISS_REASONS, { error: `must be one of: ${DISMISS_REASONS.join(", ")}` }),
    }),
  ],
  { error: "must be one of: confirm, repair, initial-test, follow-up-test, close, close-left-service, dismiss" },
);
export type FindingActionInput = z.input<typeof findingActionInput>;

export const findingEventDetail = findingEvent.extend({
  kind: z.enum(FINDING_EVENT_KINDS),
  result: z.enum(["passed", "failed"]).nullable(),
  byId: z.uuid(),
});

export const findingDeadline = z.object({
  what: text(),
  dueOn: text(),
  state: z.enum(["overdue", "due-today", "due-soon", "upcoming"]),
  daysLeft: z.number(),
  source: text(),
});

/** The Finding contract plus what the finding screen shows; every added field is extra, none changed. */
export const findingDetail = finding.extend({
  events: z.array(findingEventDetail),
  storeName: text(),
  timeZone: text(),
  systemName: text().nullable(),
  /** The fixture's label on the plan ("Dairy 3"), when the finding names one. */
  fixtureLabel: text().nullable(),
  refrigerantId: text().nullable(),
  dismissReason: z.enum(DISMISS_REASONS).nullable(),
  nextActions: z.array(
    z.enum(["confirm", "repair", "initial-test", "follow-up-test", "close", "close-left-service", "dismiss"]),
  ),
  /** The day the finding's system left service (store calendar), or null while it is in service or has none. */
  systemRetiredOn: text().nullable(),
  deadlines: z.array(findingDeadline),
  cautions: z.array(z.object({ id: text(), level: z.enum(["warning", "notice"]), text: text(), source: text() })),
});
export type FindingDetail = z.infer<typeof findingDetail>;
export const findingListResponse = z.object({ findings: z.array(findingDetail) });
