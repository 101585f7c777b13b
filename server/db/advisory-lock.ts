import type pg from "pg";

/**
 * Runs `fn` while holding a PostgreSQL session-level advisory lock on one connection of its own,
 * so only one process at a time runs it (advisory locks are per database). The lock goes with the
 * connection if the process dies.
 */
export async function withAdvisoryLock<T>(pool: pg.Pool, key: number, fn: () => Promise<T>): Promise<T> {
  const client = await pool.connect();
  let broken: Error | undefined;
  try {
    await client.query("select pg_advisory_lock($1)", [key]);
    try {
      return await fn();
    } finally {
      await client.query("select pg_advisory_unlock($1)", [key]);
    }
  } catch (err) {
    broken = err as Error;
    throw err;
  } finally {
    // A connection that failed is thrown away, not handed back to the pool.
    client.release(broken);
  }
}
