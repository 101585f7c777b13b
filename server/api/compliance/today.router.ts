import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { sendDigest } from "../../jobs/digest";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { loadVisibleStore } from "../../access/store-access";
import { today } from "./today.service";

const todayQuery = z.object({ storeId: z.uuid("must be a valid id").optional() });

export function todayRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/today", requireMember("stores.read"), validate(todayQuery, "query"), async (req, res) => {
    const { storeId } = res.locals.query as z.infer<typeof todayQuery>;
    if (storeId) await loadVisibleStore(ctx, member(req), storeId);
    res.json(await today(ctx, member(req), { storeId }));
  });

  /** The owner's "send today's digest now": the same once-a-day send the schedule makes. */
  router.post("/digest/send-now", requireMember("digest.send"), async (req, res) => {
    res.json(await sendDigest(ctx, member(req).companyId, "manual"));
  });

  return router;
}
