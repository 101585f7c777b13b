/**
 * Whether an error means the database cannot be reached right now (restart, failover, network),
 * as opposed to a bug or bad data: such requests answer 503 with Retry-After instead of 500.
 */
const NETWORK_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "EHOSTUNREACH", "ENOTFOUND"]);
// SQLSTATE: 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now, 53300 too_many_connections,
// class 08 connection exceptions (PostgreSQL manual, appendix A "Error Codes").
const SQLSTATES = new Set(["57P01", "57P02", "57P03", "53300"]);
const MESSAGES = [
  /Connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /Client has encountered a connection error/i,
  /Connection ended/i,
  /the database system is (starting up|shutting down|in recovery mode)/i,
];

export function isDatabaseUnavailable(err: unknown): boolean {
  // Drizzle wraps driver errors (DrizzleQueryError) with the original as `cause`.
  for (let e = err, depth = 0; e && typeof e === "object" && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, message } = e as { code?: unknown; message?: unknown };
    if (typeof code === "string" && (NETWORK_CODES.has(code) || SQLSTATES.has(code) || /^08/.test(code))) return true;
    if (typeof message === "string" && MESSAGES.some((m) => m.test(message))) return true;
  }
  return false;
}

/** Seconds a client is asked to wait before retrying while the database is away. */
export const DATABASE_RETRY_AFTER_S = 5;
