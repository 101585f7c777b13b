import pg from "pg";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import path from "node:path";
import * as schema from "./schema/index";
import { withAdvisoryLock } from "./advisory-lock";
import { APP_ROOT } from "../paths";

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };

export interface DbOptions {
  /** Told about a pooled connection that broke (a database restart); the pool replaces it. */
  onConnectionError?: (err: Error) => void;
  /** Longest wait for a connection before a query fails (and the request answers 503). */
  connectTimeoutMs?: number;
}

export function createDb(connectionString: string, options: DbOptions = {}): { pool: pg.Pool; db: Db } {
  const pool = new pg.Pool({ connectionString, max: 10, connectionTimeoutMillis: options.connectTimeoutMs ?? 5_000 });
  // Without listeners a connection killed by a database restart would crash the process: the pool
  // reports idle ones; a checked-out one (inside a transaction, between queries) reports on itself,
  // and its next query fails, so the request answers 503. The pool drops broken connections.
  pool.on("error", (err) => options.onConnectionError?.(err));
  pool.on("connect", (client) => {
    client.on("error", (err) => options.onConnectionError?.(err));
  });
  const db = drizzle(pool, { schema, casing: "snake_case" }) as Db;
  return { pool, db };
}

/** Key of the session-level advisory lock that several processes starting at once queue on. */
export const MIGRATION_LOCK_KEY = 4242002;

/** Drizzle's migrator takes no lock of its own: processes starting together take turns. */
export async function migrateDb(db: Db): Promise<void> {
  await withAdvisoryLock(db.$client, MIGRATION_LOCK_KEY, () =>
    migrate(db, { migrationsFolder: path.join(APP_ROOT, "drizzle") }),
  );
}
