import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { analysisQuery } from "#core/contracts/analysis";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { getAnalysis } from "./analysis.service";
import { fixtureTrends } from "./fixture-trends.service";
import { fixtureTrendsQuery } from "#core/contracts/fixture-trends";

const idParam = z.object({ id: z.uuid("must be a valid id") });
const storeParam = z.object({ storeId: z.uuid("must be a valid id") });

export function analysisRouter(ctx: AppContext): Router {
  const router = Router();
  router.get(
    "/sweeps/:id/analysis",
    requireMember("sweeps.read"),
    validate(idParam, "params"),
    validate(analysisQuery, "query"),
    async (req, res) => {
      res.json(await getAnalysis(ctx, member(req), res.locals.params.id, res.locals.query));
    },
  );
  router.get(
    "/stores/:storeId/fixture-trends",
    requireMember("sweeps.read"),
    validate(storeParam, "params"),
    validate(fixtureTrendsQuery, "query"),
    async (req, res) => {
      res.json(await fixtureTrends(ctx, member(req), res.locals.params.storeId, res.locals.query));
    },
  );
  return router;
}
