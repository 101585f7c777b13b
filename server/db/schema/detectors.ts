import { date, index, jsonb, pgTable, real, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { companies } from "./companies";

export const SENSING_PRINCIPLES = ["heated-diode", "infrared", "other"] as const;

/** A band of a detector without a ppm display: what a shown level means in ppm. */
export interface LevelBand {
  level: string;
  minPpm: number;
  maxPpm: number | null;
}

/** A technician's leak detector. Times in seconds, levels in ppm. */
export const detectors = pgTable(
  "detectors",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    name: text().notNull(),
    principle: text({ enum: SENSING_PRINCIPLES }).notNull(),
    transportDelayS: real().notNull().default(5),
    timeConstantS: real().notNull().default(1.5),
    alarmPpm: real().notNull().default(2),
    lastCheckedOn: date({ mode: "string" }),
    levelScale: jsonb().$type<LevelBand[]>(),
    archivedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("detectors_company").on(t.companyId)],
);
