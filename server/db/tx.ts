import type { Db } from "./client";

/** A Drizzle transaction on our schema: what `db.transaction(async (tx) => ...)` hands its callback. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** Data functions that work inside or outside a transaction take either. */
export type DbOrTx = Db | Tx;
