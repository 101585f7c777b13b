import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { createSweepInput, readingEditInput, readingsBatchInput, sweepPassInput } from "#core/contracts/sweeps";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { syncThrottle } from "../../middleware/sync-throttle";
import { deleteReading, editReading, listReadings, readingAuditTrail, uploadReadings } from "./readings.service";
import { savePass } from "./passes.service";
import { createSweep, getSweep, listInProgressSweeps, listSweeps, setSweepStatus } from "./sweeps.service";

const storeParam = z.object({ storeId: z.uuid("must be a valid id") });
const idParam = z.object({ id: z.uuid("must be a valid id") });
const readingParam = z.object({ id: z.uuid("must be a valid id"), readingId: z.uuid("must be a valid id") });
const passParam = z.object({ id: z.uuid("must be a valid id"), passId: z.uuid("must be a valid id") });
const deleteQuery = z.object({
  editedAt: z.iso.datetime({ offset: true, message: "must be a date and time" }).optional(),
});

export function sweepsRouter(ctx: AppContext): Router {
  const router = Router();
  const userId = (req: { auth?: { user: { id: string } } }) => req.auth!.user.id;
  // One budget for every write the Walk client's sync pass makes.
  const throttle = syncThrottle(ctx, ctx.config.syncThrottle);

  router.get(
    "/stores/:storeId/sweeps",
    requireMember("stores.read"),
    validate(storeParam, "params"),
    async (req, res) => {
      res.json({ sweeps: await listSweeps(ctx, member(req), res.locals.params.storeId) });
    },
  );
  router.post(
    "/stores/:storeId/sweeps",
    requireMember("sweeps.record"),
    throttle,
    validate(storeParam, "params"),
    validate(createSweepInput),
    async (req, res) => {
      const { sweep, created } = await createSweep(ctx, member(req), userId(req), res.locals.params.storeId, req.body);
      res.status(created ? 201 : 200).json(sweep);
    },
  );
  // Before /sweeps/:id, which would read "in-progress" as an id.
  router.get("/sweeps/in-progress", requireMember("sweeps.record"), async (req, res) => {
    res.json({ sweeps: await listInProgressSweeps(ctx, member(req), userId(req)) });
  });
  router.get("/sweeps/:id", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getSweep(ctx, member(req), res.locals.params.id));
  });
  router.post(
    "/sweeps/:id/submit",
    requireMember("sweeps.record"),
    throttle,
    validate(idParam, "params"),
    async (req, res) => {
      res.json(await setSweepStatus(ctx, member(req), userId(req), res.locals.params.id, "submitted"));
    },
  );
  router.post("/sweeps/:id/review", requireMember("sweeps.review"), validate(idParam, "params"), async (req, res) => {
    res.json(await setSweepStatus(ctx, member(req), userId(req), res.locals.params.id, "reviewed"));
  });

  // A pinpoint pass: made on the device (its id too), so a resend is harmless; a resend may add the end.
  router.put(
    "/sweeps/:id/passes/:passId",
    requireMember("sweeps.record"),
    throttle,
    validate(passParam, "params"),
    validate(sweepPassInput),
    async (req, res) => {
      const { id, passId } = res.locals.params;
      res.json(await savePass(ctx, member(req), userId(req), id, passId, req.body));
    },
  );

  router.get("/sweeps/:id/readings", requireMember("sweeps.read"), validate(idParam, "params"), async (req, res) => {
    res.json({ readings: await listReadings(ctx, member(req), res.locals.params.id) });
  });
  router.post(
    "/sweeps/:id/readings",
    requireMember("sweeps.record"),
    throttle,
    validate(idParam, "params"),
    validate(readingsBatchInput),
    async (req, res) => {
      res.json(await uploadReadings(ctx, member(req), userId(req), res.locals.params.id, req.body.readings));
    },
  );
  router.patch(
    "/sweeps/:id/readings/:readingId",
    requireMember("sweeps.record"),
    throttle,
    validate(readingParam, "params"),
    validate(readingEditInput),
    async (req, res) => {
      res.json(
        await editReading(ctx, member(req), userId(req), res.locals.params.id, res.locals.params.readingId, req.body),
      );
    },
  );
  router.delete(
    "/sweeps/:id/readings/:readingId",
    requireMember("sweeps.record"),
    throttle,
    validate(readingParam, "params"),
    validate(deleteQuery, "query"),
    async (req, res) => {
      res.json(
        await deleteReading(
          ctx,
          member(req),
          userId(req),
          res.locals.params.id,
          res.locals.params.readingId,
          res.locals.query.editedAt,
        ),
      );
    },
  );
  router.get("/sweeps/:id/audit", requireMember("sweeps.read"), validate(idParam, "params"), async (req, res) => {
    res.json({ entries: await readingAuditTrail(ctx, member(req), res.locals.params.id) });
  });

  return router;
}
