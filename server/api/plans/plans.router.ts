import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import {
  alignmentInput,
  blankPlanInput,
  calibrationInput,
  fixturesPutInput,
  imageVariantSchema,
} from "#core/contracts/plans";
import { member, requireMember } from "../../middleware/auth";
import { singleUpload, uploadTmpDir } from "../../middleware/upload";
import { validate } from "../../middleware/validate";
import { loadVisibleStore } from "../../access/store-access";
import { setAlignment } from "./alignment.service";
import { calibratePlan } from "./calibration.service";
import { getFixtures, putFixtures } from "./fixtures.service";
import { planImageLimits } from "./plan-resources";
import { getPlan, listPlans, readPlanImage } from "./plans.service";
import { createBlankPlan, createImagePlan } from "./plan-upload.service";

const storeParam = z.object({ storeId: z.uuid("must be a valid id") });
const idParam = z.object({ id: z.uuid("must be a valid id") });
const imageQuery = z.object({ variant: imageVariantSchema.default("display") });

export function plansRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    "/stores/:storeId/plans",
    requireMember("stores.read"),
    validate(storeParam, "params"),
    async (req, res) => {
      res.json({ plans: await listPlans(ctx, member(req), res.locals.params.storeId) });
    },
  );

  router.post(
    "/stores/:storeId/plans",
    requireMember("plans.edit"),
    validate(storeParam, "params"),
    // The store is checked before the body is read: no upload is taken in for a stranger's store.
    async (req, res, next) => {
      await loadVisibleStore(ctx, member(req), res.locals.params.storeId);
      next();
    },
    singleUpload(
      "image",
      () => planImageLimits(ctx).maxBytes,
      () => uploadTmpDir(ctx.config.uploadTmpDir),
    ),
    async (req, res) => {
      res
        .status(201)
        .json(await createImagePlan(ctx, member(req), req.auth!.user.id, res.locals.params.storeId, req.file));
    },
  );

  router.post(
    "/stores/:storeId/plans/blank",
    requireMember("plans.edit"),
    validate(storeParam, "params"),
    validate(blankPlanInput),
    async (req, res) => {
      res
        .status(201)
        .json(await createBlankPlan(ctx, member(req), req.auth!.user.id, res.locals.params.storeId, req.body));
    },
  );

  router.get("/plans/:id", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getPlan(ctx, member(req), res.locals.params.id));
  });

  // Images are served only through this authorized route, never from a public folder.
  router.get(
    "/plans/:id/image",
    requireMember("stores.read"),
    validate(idParam, "params"),
    validate(imageQuery, "query"),
    async (req, res) => {
      const image = await readPlanImage(ctx, member(req), res.locals.params.id, res.locals.query.variant);
      res.set({
        "Content-Type": image.mime,
        "Cache-Control": "private, max-age=3600",
        "X-Content-Type-Options": "nosniff",
      });
      res.send(image.data);
    },
  );

  router.post(
    "/plans/:id/calibration",
    requireMember("plans.edit"),
    validate(idParam, "params"),
    validate(calibrationInput),
    async (req, res) => {
      res.json(await calibratePlan(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  router.put(
    "/plans/:id/alignment",
    requireMember("plans.edit"),
    validate(idParam, "params"),
    validate(alignmentInput),
    async (req, res) => {
      res.json(await setAlignment(ctx, member(req), res.locals.params.id, req.body));
    },
  );

  router.get("/plans/:id/fixtures", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getFixtures(ctx, member(req), res.locals.params.id));
  });

  router.put(
    "/plans/:id/fixtures",
    requireMember("plans.edit"),
    validate(idParam, "params"),
    validate(fixturesPutInput),
    async (req, res) => {
      res.json(await putFixtures(ctx, member(req), res.locals.params.id, req.body));
    },
  );

  return router;
}
