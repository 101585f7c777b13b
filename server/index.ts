import type { AddressInfo } from "node:net";
import { readEnv } from "./env";
import { bootstrap } from "./bootstrap";
import { createApp } from "./app";
import { seedDemoIfEmpty, DEMO_SIGN_INS } from "./db/seed/demo";
import { startDigestSchedule } from "./jobs/digest";

// Listening and shutting down only; the app itself is built in app.ts.
const env = readEnv();
const runtime = await bootstrap(env);
const { ctx } = runtime;

if (env.SEED_DEMO === "true") {
  const seeded = await seedDemoIfEmpty(ctx);
  if (seeded) ctx.logger.info("demo company seeded");
}

// The daily digest runs in the serving process; tests start it only when they ask for it.
const digest = startDigestSchedule(ctx);

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

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  ctx.logger.info({ signal }, "shutting down");
  digest.stop();
  server.close();
  server.closeAllConnections();
  await runtime.close();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
