import pg from "pg";
import { randomBytes } from "node:crypto";
import { createDb, migrateDb, type Db } from "../../server/db/client";

export interface TestDatabase {
  url: string;
  pool: pg.Pool;
  db: Db;
  drop(): Promise<void>;
}

function adminUrl(): string {
  const url = process.env.TEST_ADMIN_DATABASE_URL;
  if (!url) throw new Error("TEST_ADMIN_DATABASE_URL is not set: run `npm test`.");
  return url;
}

/** A fresh, migrated database for one test file, dropped afterwards. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const name = `plumeline_t_${process.pid}_${randomBytes(4).toString("hex")}`;
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`create database ${name}`);
  await admin.end();
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  const { pool, db } = createDb(url.toString());
  await migrateDb(db);
  return {
    url: url.toString(),
    pool,
    db,
    async drop() {
      await pool.end();
      const a = new pg.Client({ connectionString: adminUrl() });
      await a.connect();
      // pool.end() resolves once its clients are told to end, not once they have gone: wait
      // (up to 2 s) for them to leave, so "with (force)" does not kill one mid-goodbye (57P01).
      for (let i = 0; i < 40; i++) {
        const { rows } = await a.query("select count(*)::int as n from pg_stat_activity where datname = $1", [name]);
        if (rows[0].n === 0) break;
        await new Promise((r) => setTimeout(r, 50));
      }
      await a.query(`drop database if exists ${name} with (force)`);
      await a.end();
    },
  };
}
