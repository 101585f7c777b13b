import pg from "pg";
import { createHash, randomBytes } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { createDb, migrateDb, type Db } from "../../server/db/client";

export interface TestDatabase {
  url: string;
  pool: pg.Pool;
  db: Db;
  drop(): Promise<void>;
}

const MIGRATIONS = path.resolve(import.meta.dirname, "../../drizzle");

function adminUrl(): string {
  const url = process.env.TEST_ADMIN_DATABASE_URL;
  if (!url) throw new Error("TEST_ADMIN_DATABASE_URL is not set: run `npm test`.");
  return url;
}

function databaseUrl(name: string): string {
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  return url.toString();
}

/** The template's name changes with the migrations, so a new migration never meets a stale template. */
function templateName(): string {
  const hash = createHash("sha256");
  for (const file of readdirSync(MIGRATIONS, { recursive: true }).map(String).sort()) {
    if (file.endsWith(".sql") || file.endsWith(".json"))
      hash.update(file).update(readFileSync(path.join(MIGRATIONS, file)));
  }
  return `plumeline_template_${hash.digest("hex").slice(0, 12)}`;
}

async function withAdmin<T>(work: (admin: pg.Client) => Promise<T>): Promise<T> {
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  try {
    return await work(admin);
  } finally {
    await admin.end();
  }
}

/**
 * A migrated database that every test database is copied from (CREATE DATABASE … TEMPLATE): one
 * migration run per change of the migrations instead of one per test file. Made once, under an
 * advisory lock, by whichever process gets there first.
 */
export async function ensureTemplateDatabase(): Promise<string> {
  const name = templateName();
  await withAdmin(async (admin) => {
    await admin.query("select pg_advisory_lock(hashtext('plumeline test template'))");
    try {
      const { rowCount } = await admin.query("select 1 from pg_database where datname = $1", [name]);
      if (rowCount) return;
      const building = `${name}_building_${randomBytes(3).toString("hex")}`;
      await admin.query(`create database ${building}`);
      const { pool, db } = createDb(databaseUrl(building));
      try {
        await migrateDb(db);
      } finally {
        await pool.end();
      }
      await waitForNoConnections(admin, building);
      await admin.query(`alter database ${building} rename to ${name}`);
    } finally {
      await admin.query("select pg_advisory_unlock(hashtext('plumeline test template'))");
    }
  });
  return name;
}

/** pool.end() resolves once its clients are told to end, not once they have gone: wait up to 2 s. */
async function waitForNoConnections(admin: pg.Client, name: string): Promise<void> {
  for (let i = 0; i < 40; i++) {
    const { rows } = await admin.query("select count(*)::int as n from pg_stat_activity where datname = $1", [name]);
    if (rows[0].n === 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** A fresh, migrated database for one test file (a copy of the template), dropped afterwards. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const template = await ensureTemplateDatabase();
  const name = `plumeline_t_${process.pid}_${randomBytes(4).toString("hex")}`;
  await withAdmin((admin) => admin.query(`create database ${name} template ${template}`));
  const url = databaseUrl(name);
  const { pool, db } = createDb(url);
  return {
    url,
    pool,
    db,
    async drop() {
      await pool.end();
      await withAdmin(async (admin) => {
        await waitForNoConnections(admin, name); // so "with (force)" does not kill one mid-goodbye (57P01)
        await admin.query(`drop database if exists ${name} with (force)`);
      });
    },
  };
}
