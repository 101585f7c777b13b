import { Router } from "express";
import type { AppContext } from "../../context";
import { member, requireMember } from "../../middleware/auth";
import { failedJobs } from "./failed-jobs";

/** Owners see the company's jobs that failed after every retry, with the reason (docs/decisions/0035, 0085). */
export function jobsRouter(ctx: AppContext): Router {
  const router = Router();
  router.get("/jobs/failed", requireMember("settings.manage"), async (req, res) => {
    res.json({ jobs: await failedJobs(ctx, member(req).companyId) });
  });
  return router;
}
