import { Router } from "express";
import { and, desc, eq, ne } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { FailedJob } from "#core/contracts/jobs";
import { outgoingMail } from "../../db/schema/index";
import { member, requireMember } from "../../middleware/auth";

/** Owners see the company's jobs that failed after every retry, with the reason (docs/decisions/0035). */
export function jobsRouter(ctx: AppContext): Router {
  const router = Router();
  router.get("/jobs/failed", requireMember("settings.manage"), async (req, res) => {
    const rows = await ctx.db
      .select()
      .from(outgoingMail)
      .where(
        and(
          eq(outgoingMail.companyId, member(req).companyId),
          eq(outgoingMail.state, "failed"),
          // Resets carry no company; never list them even so (they must not reveal an account).
          ne(outgoingMail.kind, "password-reset"),
        ),
      )
      .orderBy(desc(outgoingMail.createdAt))
      .limit(200);
    const jobs: FailedJob[] = rows.map((r) => ({
      id: r.id,
      kind: r.kind as FailedJob["kind"],
      subjectId: r.subjectId,
      to: r.to,
      subject: r.subject,
      attempts: r.attempts,
      reason: r.lastError,
      queuedAt: r.createdAt.toISOString(),
    }));
    res.json({ jobs });
  });
  return router;
}
