import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

/** Messages caught by the built-in fake SMTP server (demo and tests), listed on the Outbox screen. */
export const outboxMessages = pgTable(
  "outbox_messages",
  {
    id: uuid().primaryKey().defaultRandom(),
    // The company the message was sent for, when the sender knew it (null for sign-in mail such as resets).
    companyId: uuid(),
    from: text().notNull(),
    to: text().array().notNull(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text(),
    attachments: jsonb().$type<{ filename: string; contentType: string; size: number }[]>().notNull().default([]),
    rawSize: integer().notNull(),
    receivedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("outbox_received").on(t.receivedAt)],
);
