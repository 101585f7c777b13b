import type { AddressInfo } from "node:net";
import { readEnv } from "./env";
import { bootstrap } from "./bootstrap";
import { createApp } from "./app";
import { seedDemoIfEmpty, DEMO_SIGN_INS } from "./db/seed/demo";
import { waitUntil } from "./lifecycle";
import { cpuPoolLoad } from "./jobs/cpu-pool";
import { applyIdleTimeouts } from "./lib/idle-timeouts";

// Listening and shutting down only; the app itself is built in app.ts.
const env = readEnv();
const runtime = await bootstrap(env);
const { ctx } = runtime;

if (env.SEED_DEMO === "true") {
  const seeded = await seedDemoIfEmpty(ctx);
  if (seeded) ctx.logger.info("demo company seeded");
}

const server = createApp(ctx).listen(env.PORT, env.HOST, () => {
  const { port } = server.address() as AddressInfo;
  const url = `http://${env.HOST}:${port}`;
  const lines = [
    "",
    `  Plumeline is running at ${url}`,
    runtime.fakeSmtp
      ? `  Mail goes to the built-in test mail server (port ${runtime.fakeSmtp.port}); read it on the Outbox screen.`
      : "",
    "",
    "  Demo sign-ins (password for all: " + DEMO_SIGN_INS.password + "):",
    ...DEMO_SIGN_INS.people.map((p) => `    ${p.role.padEnd(14)} ${p.email}`),
    "",
    "  Press Ctrl-C to stop.",
    "",
  ];
  console.log(lines.filter((l, i) => l !== "" || i === 0 || lines[i - 1] !== "").join("\n"));
});
applyIdleTimeouts(server, env.KEEP_ALIVE_TIMEOUT_MS);

let closing: string | null = null;
/**
 * Graceful stop: report not-ready (for SHUTDOWN_DELAY_MS while still serving), stop accepting, let in-flight requests and the CPU
 * pool's tasks finish (bounded by SHUTDOWN_GRACE_MS), then stop the pool's workers and close the database pool.
 */
async function shutdown(signal: string) {
  if (closing) {
    // The same signal again (Ctrl-C twice) stops at once; another kind (the start script's TERM
    // after the terminal's INT) lets the drain go on.
    if (signal !== closing) return;
    ctx.logger.warn({ signal }, "second signal: stopping now");
    process.exit(1);
  }
  closing = signal;
  const deadline = Date.now() + env.SHUTDOWN_GRACE_MS;
  ctx.logger.info({ signal, graceMs: env.SHUTDOWN_GRACE_MS }, "shutting down: draining");
  ctx.lifecycle!.draining = true;
  if (env.SHUTDOWN_DELAY_MS > 0) await new Promise((r) => setTimeout(r, env.SHUTDOWN_DELAY_MS));
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  // Keep-alive connections go once their current answer is out (it carries Connection: close).
  const sweepIdle = setInterval(() => server.closeIdleConnections(), 250);
  server.closeIdleConnections();
  const cutOff = setTimeout(
    () => {
      ctx.logger.warn("grace period over: closing the connections still open");
      server.closeAllConnections();
    },
    Math.max(0, deadline - Date.now()),
  );
  await closed;
  clearTimeout(cutOff);
  clearInterval(sweepIdle);
  const jobsDone = await waitUntil(
    () => cpuPoolLoad() + (ctx.jobs?.active ?? 0) === 0,
    Math.max(deadline, Date.now() + 1_000),
  );
  if (!jobsDone) ctx.logger.warn("grace period over: stopping the jobs still running");
  await runtime.close();
  ctx.logger.info("stopped");
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
