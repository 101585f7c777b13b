import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { MAIL_DELIVERY_STATES } from "#core/contracts/mail-delivery";

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

export const MAIL_KINDS = ["invitation", "report", "digest", "password-reset", "sign-up"] as const;
/** "preparing": a report whose PDF a job is still making (its `text` is then the sender's own note). */
export const MAIL_STATES = MAIL_DELIVERY_STATES;

/**
 * The durable outgoing mail queue's messages (server/mail/mail-queue.ts): written in the request's
 * transaction, delivered by a job-queue worker with retries. The body and attachments are cleared
 * once sent; state, attempts and the last error stay so the sender can see what happened.
 */
export const outgoingMail = pgTable(
  "outgoing_mail",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid(),
    kind: text({ enum: MAIL_KINDS }).notNull(),
    /** What it is about: the invitation's or report send's id (null for resets and digests). */
    subjectId: uuid(),
    to: text().array().notNull(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text(),
    attachments: jsonb()
      .$type<{ filename: string; contentType: string; contentBase64: string }[]>()
      .notNull()
      .default([]),
    state: text({ enum: MAIL_STATES }).notNull().default("queued"),
    attempts: integer().notNull().default(0),
    lastError: text(),
    /**
     * The job that delivers it; null until handed to the job queue (a sweep re-hands such rows).
     * While "preparing", the job that makes its attachment.
     */
    jobId: text(),
    /** A worker delivering it holds it until then, so two jobs for one message never both send. */
    lockedUntil: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp({ withTimezone: true }),
  },
  (t) => [index("outgoing_mail_subject").on(t.subjectId), index("outgoing_mail_state").on(t.state, t.createdAt)],
);
