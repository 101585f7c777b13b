import { afterAll, beforeAll, expect, it } from "vitest";
import pg from "pg";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createDb, migrateDb } from "./client";
import { seedDemoIfEmpty } from "./seed/demo";
import type { AppContext } from "../context";

// Several app processes starting at once on one fresh database: each brings its own pool, as
// separate processes would, and all run the migrations and the demo seed together.
const admin = process.env.TEST_ADMIN_DATABASE_URL!;
const name = `plumeline_lock_${randomBytes(4).toString("hex")}`;
let url: string;

beforeAll(async () => {
  const c = new pg.Client({ connectionString: admin });
  await c.connect();
  await c.query(`create database ${name}`);
  await c.end();
  const u = new URL(admin);
  u.pathname = `/${name}`;
  url = u.toString();
});

afterAll(async () => {
  const c = new pg.Client({ connectionString: admin });
  await c.connect();
  await c.query(`drop database if exists ${name} with (force)`);
  await c.end();
});

it("four processes migrating and seeding one empty database at once apply each migration once and seed once", async () => {
  const processes = Array.from({ length: 4 }, () => createDb(url));
  try {
    const outcomes = await Promise.allSettled(processes.map(({ db }) => migrateDb(db)));
    expect(outcomes.filter((o) => o.status === "rejected")).toEqual([]);
    const uploadsDir = fs.mkdtempSync(path.join(os.tmpdir(), "plumeline-lock-"));
    const seeded = await Promise.all(
      processes.map(({ db, pool }) =>
        seedDemoIfEmpty({ db, pool, config: { bcryptCost: 4, uploadsDir } } as unknown as AppContext),
      ),
    ).finally(() => fs.rmSync(uploadsDir, { recursive: true, force: true }));
    expect(seeded.filter(Boolean)).toHaveLength(1);

    const journal = JSON.parse(
      fs.readFileSync(path.resolve(import.meta.dirname, "../../drizzle/meta/_journal.json"), "utf8"),
    );
    const { rows } = await processes[0].pool.query("select hash from drizzle.__drizzle_migrations");
    expect(rows).toHaveLength(journal.entries.length);
    const companies = await processes[0].pool.query("select count(*)::int as n from companies");
    expect(companies.rows[0].n).toBe(1);
  } finally {
    await Promise.all(processes.map(({ pool }) => pool.end()));
  }
});
