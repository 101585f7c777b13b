/**
 * A PostgreSQL cluster of a test file's own (scripts/pg.sh, data under .data/NAME), for fault
 * tests that stop and start the database: the shared test cluster is never touched.
 */
import { execFile } from "node:child_process";
import { randomBytes } from "node:crypto";
import net from "node:net";
import path from "node:path";
import { promisify } from "node:util";
import pg from "pg";

const run = promisify(execFile);
const ROOT = path.resolve(import.meta.dirname, "../..");

/** A port nobody listens on right now (asked of the OS on loopback). */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export interface OwnCluster {
  port: number;
  name: string;
  /** postgres://…/DB on this cluster */
  url(db: string): string;
  createDatabase(db: string): Promise<string>;
  start(): Promise<void>;
  /** pg_ctl stop -m fast: connections are terminated, as in a restart or failover. */
  stop(): Promise<void>;
  destroy(): Promise<void>;
}

async function pgsh(cmd: string, name: string, port: number) {
  await run("bash", ["scripts/pg.sh", cmd, name, String(port)], {
    cwd: ROOT,
    timeout: 120_000,
    env: { ...process.env, PG_EXTRA_OPTS: "-c fsync=off -c full_page_writes=off" },
  });
}

export async function startOwnCluster(label: string): Promise<OwnCluster> {
  const name = `${label}-${process.pid}-${randomBytes(3).toString("hex")}`;
  const port = await freePort();
  await pgsh("start", name, port);
  const url = (db: string) => `postgres://postgres@127.0.0.1:${port}/${db}`;
  return {
    port,
    name,
    url,
    async createDatabase(db) {
      const admin = new pg.Client({ connectionString: url("postgres") });
      await admin.connect();
      await admin.query(`create database ${db}`);
      await admin.end();
      return url(db);
    },
    start: () => pgsh("start", name, port),
    stop: () => pgsh("stop", name, port),
    destroy: () => pgsh("destroy", name, port),
  };
}
