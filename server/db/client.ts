import pg from "pg";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import path from "node:path";
import * as schema from "./schema/index";

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };

export function createDb(connectionString: string): { pool: pg.Pool; db: Db } {
  const pool = new pg.Pool({ connectionString, max: 10 });
  const db = drizzle(pool, { schema, casing: "snake_case" }) as Db;
  return { pool, db };
}

export async function migrateDb(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: path.resolve(import.meta.dirname, "../../drizzle") });
}
