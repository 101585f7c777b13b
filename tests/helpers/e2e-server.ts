import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import type { AppConfig } from "../../server/context";
import { createTestApp, type TestApp } from "./test-app";
import { createJobQueue } from "../../server/jobs/job-queue";
import { startJobs } from "../../server/jobs/job-kinds";

export interface E2eServer extends TestApp {
  url: string;
  server: Server;
}

/** The real app with the built client, listening on a free loopback port, on a private database. */
export async function startE2eServer(config: Partial<AppConfig> = {}): Promise<E2eServer> {
  const t = await createTestApp({ serveClient: true, ...config });
  // The browser reads the Outbox as a person would: mail goes out through the real job-queue worker.
  await t.ctx.mailer.start();
  // Field maps are computed by the real job worker too (no digest schedule: it would add mail).
  const jobs = createJobQueue(t.database.db, t.ctx.logger, { pollingIntervalS: 0.5 });
  await startJobs(t.ctx, jobs, { digests: false });
  const server = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, "127.0.0.1", () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  t.ctx.config.appUrl = url;
  return {
    ...t,
    url,
    server,
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await jobs.stop();
      await t.close();
    },
  };
}
