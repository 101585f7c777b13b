import { index, integer, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { companies } from "./companies";
import { sweeps } from "./sweeps";
import { users } from "./users";

/**
 * Every sweep report e-mailed: who sent which report to whom and when. Written when Send is pressed;
 * updated once, by the job that makes its PDF (its size and the readings revision it was made from).
 */
export const reportSends = pgTable(
  "report_sends",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    sweepId: uuid()
      .notNull()
      .references(() => sweeps.id, { onDelete: "cascade" }),
    sentById: uuid().references(() => users.id, { onDelete: "set null" }),
    recipients: text().array().notNull(),
    subject: text().notNull(),
    filename: text().notNull(),
    /** The PDF's size; 0 until the job has made it (a PDF is never empty). */
    bytes: integer().notNull(),
    /** The sweep's readings revision the report was made from (at Send until the PDF is made). */
    readingsRevision: integer().notNull(),
    sentAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("report_sends_sweep").on(t.sweepId), index("report_sends_company").on(t.companyId)],
);
