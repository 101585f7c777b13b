/**
 * The server as a child process running the production build (`node dist/server/index.js`, made by
 * scripts/build.mjs, which `npm test` runs first), for fault tests that stop its database or
 * signal it and for the two-process tests. Loopback only; its output is kept for failure messages.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { freePort } from "./own-cluster";

const ROOT = path.resolve(import.meta.dirname, "../..");
const SERVER_BUILD = "dist/server/index.js";

export interface AppProcess {
  url: string;
  port: number;
  child: ChildProcess;
  output(): string;
  /** Resolves with the exit code (or signal name) once the process has gone. */
  exited: Promise<number | string>;
  alive(): boolean;
  kill(signal: NodeJS.Signals): void;
}

/** Starts the app; `port` reuses one (a restart in place), otherwise a free one is taken. */
export async function startAppProcess(env: Record<string, string>, port?: number): Promise<AppProcess> {
  port ??= await freePort();
  if (!existsSync(path.join(ROOT, SERVER_BUILD)))
    throw new Error(`${SERVER_BUILD} is missing: run \`node scripts/build.mjs\` (npm test does)`);
  const child = spawn(process.execPath, ["--enable-source-maps", SERVER_BUILD], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: "test",
      HOST: "127.0.0.1",
      PORT: String(port),
      FAKE_SMTP_PORT: "0",
      SEED_DEMO: "false",
      BCRYPT_COST: "4",
      LOG_LEVEL: "warn",
      ...env,
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  let done = false;
  const exited = new Promise<number | string>((resolve) =>
    child.on("exit", (code, signal) => {
      done = true;
      resolve(code ?? signal ?? "unknown");
    }),
  );
  const url = `http://127.0.0.1:${port}`;
  const until = Date.now() + 60_000;
  for (;;) {
    if (done) throw new Error(`the app exited during start-up:\n${out}`);
    if (Date.now() > until) {
      child.kill("SIGKILL");
      throw new Error(`the app did not answer /healthz within 60 s:\n${out}`);
    }
    const ok = await fetch(`${url}/healthz`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    port,
    child,
    output: () => out,
    exited,
    alive: () => !done,
    kill: (signal) => child.kill(signal),
  };
}
