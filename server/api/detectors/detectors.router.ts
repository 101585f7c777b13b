import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { detectorInput } from "#core/contracts/detectors";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { createDetector, getDetector, listDetectors, setDetectorArchived, updateDetector } from "./detectors.service";

const idParam = z.object({ id: z.uuid("must be a valid id") });
const listQuery = z.object({ includeArchived: z.enum(["true", "false"]).default("false") });

export function detectorsRouter(ctx: AppContext): Router {
  const router = Router();

  // Reading needs only detectors.read (every role but the store contact, who sees only their store's reports).
  router.get("/detectors", requireMember("detectors.read"), validate(listQuery, "query"), async (req, res) => {
    res.json({
      detectors: await listDetectors(ctx, member(req).companyId, res.locals.query.includeArchived === "true"),
    });
  });
  router.get("/detectors/:id", requireMember("detectors.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getDetector(ctx, member(req).companyId, res.locals.params.id));
  });
  router.post("/detectors", requireMember("detectors.manage"), validate(detectorInput), async (req, res) => {
    res.status(201).json(await createDetector(ctx, member(req).companyId, req.body));
  });
  router.put(
    "/detectors/:id",
    requireMember("detectors.manage"),
    validate(idParam, "params"),
    validate(detectorInput),
    async (req, res) => {
      res.json(await updateDetector(ctx, member(req).companyId, res.locals.params.id, req.body));
    },
  );
  router.post(
    "/detectors/:id/archive",
    requireMember("detectors.manage"),
    validate(idParam, "params"),
    async (req, res) => {
      res.json(await setDetectorArchived(ctx, member(req).companyId, res.locals.params.id, true));
    },
  );
  router.post(
    "/detectors/:id/restore",
    requireMember("detectors.manage"),
    validate(idParam, "params"),
    async (req, res) => {
      res.json(await setDetectorArchived(ctx, member(req).companyId, res.locals.params.id, false));
    },
  );

  return router;
}
