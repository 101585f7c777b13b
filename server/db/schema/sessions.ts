import { index, json, pgTable, timestamp, varchar } from "drizzle-orm/pg-core";

// The table connect-pg-simple reads and writes, declared here so migrations own it.
export const sessions = pgTable(
  "session",
  {
    sid: varchar().primaryKey(),
    sess: json().notNull(),
    expire: timestamp({ precision: 6 }).notNull(),
  },
  (t) => [index("IDX_session_expire").on(t.expire)],
);
