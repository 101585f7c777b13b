import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { findingActionInput } from "#core/contracts/finding-actions";
import { createFindingInput } from "#core/contracts/findings";
import { member, requireMember } from "../../middleware/auth";
import { singleUpload, uploadTmpDir } from "../../middleware/upload";
import { validate } from "../../middleware/validate";
import { addFindingPhoto, PHOTO_LIMITS, readFindingPhoto } from "./finding-photos.service";
import { addFindingEvent, createFinding, getFinding, listFindings, loadFindingRow } from "./findings.service";

const storeParam = z.object({ storeId: z.uuid("must be a valid id") });
const idParam = z.object({ id: z.uuid("must be a valid id") });
const photoParams = z.object({ id: z.uuid("must be a valid id"), photoId: z.uuid("must be a valid id") });
const listQuery = z.object({
  systemId: z.uuid("must be a valid id").optional(),
  open: z.enum(["true", "false"], { error: "must be true or false" }).optional(),
});
const photoQuery = z.object({
  variant: z.enum(["photo", "thumb"], { error: "must be photo or thumb" }).default("photo"),
});

export function findingsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    "/stores/:storeId/findings",
    requireMember("findings.record"),
    validate(storeParam, "params"),
    validate(createFindingInput),
    async (req, res) => {
      const { finding, created } = await createFinding(
        ctx,
        member(req),
        req.auth!.user.id,
        res.locals.params.storeId,
        req.body,
      );
      res.status(created ? 201 : 200).json(finding);
    },
  );

  router.get(
    "/stores/:storeId/findings",
    requireMember("stores.read"),
    validate(storeParam, "params"),
    validate(listQuery, "query"),
    async (req, res) => {
      const q = res.locals.query as z.infer<typeof listQuery>;
      res.json({
        findings: await listFindings(ctx, member(req), res.locals.params.storeId, {
          systemId: q.systemId,
          open: q.open === "true",
        }),
      });
    },
  );

  router.get("/findings/:id", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getFinding(ctx, member(req), res.locals.params.id));
  });

  // Role rules per action live in core/domain/findings/lifecycle.ts (ACTION_PERMISSION).
  router.post(
    "/findings/:id/events",
    requireMember("stores.read"),
    validate(idParam, "params"),
    validate(findingActionInput),
    async (req, res) => {
      res.json(await addFindingEvent(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  router.post(
    "/findings/:id/photos",
    requireMember("findings.record"),
    validate(idParam, "params"),
    // The finding is checked before the body is read: no upload is taken in for a stranger's finding.
    async (req, res, next) => {
      await loadFindingRow(ctx, member(req), res.locals.params.id);
      next();
    },
    singleUpload(
      "photo",
      () => PHOTO_LIMITS.maxBytes,
      () => uploadTmpDir(ctx.config.uploadTmpDir),
    ),
    async (req, res) => {
      await addFindingPhoto(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.file);
      res.status(201).json(await getFinding(ctx, member(req), res.locals.params.id));
    },
  );

  // Photos are served only through this authorized route.
  router.get(
    "/findings/:id/photos/:photoId",
    requireMember("stores.read"),
    validate(photoParams, "params"),
    validate(photoQuery, "query"),
    async (req, res) => {
      const p = await readFindingPhoto(
        ctx,
        member(req),
        res.locals.params.id,
        res.locals.params.photoId,
        res.locals.query.variant,
      );
      res.set({
        "Content-Type": p.mime,
        "Cache-Control": "private, max-age=3600",
        "X-Content-Type-Options": "nosniff",
      });
      res.send(p.data);
    },
  );

  return router;
}
