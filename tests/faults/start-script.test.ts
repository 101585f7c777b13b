// `npm start`'s script under a TERM: the app drains and stops first, then PostgreSQL; no node left
// running. Own cluster name and ports, loopback only, bounded in time.
import { spawn, execFileSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { afterAll, expect, it } from "vitest";
import { freePort } from "../helpers/own-cluster";

const ROOT = path.resolve(import.meta.dirname, "../..");
const cluster = `fault-start-${process.pid}-${randomBytes(3).toString("hex")}`;
let pgPort = 0;

afterAll(() => {
  if (pgPort) execFileSync("bash", ["scripts/pg.sh", "destroy", cluster, String(pgPort)], { cwd: ROOT });
}, 60_000);

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

it("a TERM to the start script stops the app first, then PostgreSQL, and leaves no node running", async () => {
  pgPort = await freePort();
  const appPort = await freePort();
  const script = spawn("bash", ["scripts/start.sh"], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(appPort),
      PLUMELINE_PG_PORT: String(pgPort),
      PLUMELINE_PG_CLUSTER: cluster,
      PLUMELINE_BUILD_CLIENT: "no",
      FAKE_SMTP_PORT: "0",
      SEED_DEMO: "false",
      LOG_LEVEL: "info",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  script.stdout.on("data", (d) => (out += d));
  script.stderr.on("data", (d) => (out += d));
  const exited = new Promise<number | null>((resolve) => script.on("exit", (code) => resolve(code)));

  const until = Date.now() + 90_000;
  while (
    !(await fetch(`http://127.0.0.1:${appPort}/readyz`).then(
      (r) => r.ok,
      () => false,
    ))
  ) {
    if (Date.now() > until || script.exitCode !== null) throw new Error(`the app did not come up:\n${out}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  const children = execFileSync("ps", ["-o", "pid=,comm=", "--ppid", String(script.pid)], { encoding: "utf8" });
  const node = children
    .trim()
    .split("\n")
    .map((l) => l.trim().split(/\s+/))
    .find(([, comm]) => comm === "node");
  expect(node, children).toBeDefined();
  const nodePid = Number(node![0]);

  script.kill("SIGTERM");
  const code = await Promise.race([exited, new Promise((r) => setTimeout(() => r("timeout"), 60_000))]);
  expect(code).toBe(143);
  expect(alive(nodePid)).toBe(false);
  // In order: the app said it stopped before the script stopped the database.
  const appStopped = out.search(/"msg":"stopped"/);
  const pgStopping = out.indexOf("stopping PostgreSQL");
  expect(appStopped, out).toBeGreaterThan(-1);
  expect(pgStopping, out).toBeGreaterThan(appStopped);
  let pgUp = true;
  try {
    execFileSync("bash", ["scripts/pg.sh", "status", cluster, String(pgPort)], { cwd: ROOT, stdio: "ignore" });
  } catch {
    pgUp = false;
  }
  expect(pgUp).toBe(false);
}, 120_000);
