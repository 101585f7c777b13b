import { Router } from "express";
import type { AppContext } from "../../context";

/** How long /readyz waits for `select 1` before calling the database away. */
export const READY_TIMEOUT_MS = 1_000;

async function databaseAnswers(ctx: AppContext): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), READY_TIMEOUT_MS);
  });
  const query = ctx.pool.query("select 1").then(
    () => true,
    () => false,
  );
  try {
    return await Promise.race([query, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * Probes for load balancers and orchestrators, mounted before sessions so they never touch the
 * session store: /healthz (and its older name /api/health) says the process is alive without a
 * database call; /readyz says whether this process should get traffic.
 */
export function healthRouter(ctx: AppContext): Router {
  const router = Router();
  router.get(["/healthz", "/api/health"], (_req, res) => {
    res.set("Cache-Control", "no-store").json({ ok: true, status: "alive" });
  });
  router.get("/readyz", async (_req, res) => {
    res.set("Cache-Control", "no-store");
    if (ctx.lifecycle?.draining) {
      res.status(503).json({ ok: false, status: "draining", database: "not checked" });
      return;
    }
    const up = await databaseAnswers(ctx);
    res
      .status(up ? 200 : 503)
      .json({ ok: up, status: up ? "ready" : "database unavailable", database: up ? "up" : "down" });
  });
  return router;
}
