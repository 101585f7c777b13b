import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { retireInput, revisionInput, systemInput, systemListQuery, systemUpdateInput } from "#core/contracts/systems";
import { REFRIGERANTS } from "#core/domain/refrigerants/catalogue";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { refrigerantCautions, summarizeRefrigerant } from "#core/domain/refrigerants/refrigerant-summary";
import { deleteSystem, retireSystem } from "./retire-system";
import { companyRefrigerantsOf } from "../refrigerants/company-refrigerant-lookup";
import { addRevision, listRevisions } from "./system-revisions.service";
import { companyGwpBases, createSystem, getSystem, listSystems, updateSystem } from "./systems.service";

const storeParam = z.object({ storeId: z.uuid("must be a valid id") });
const idParam = z.object({ id: z.uuid("must be a valid id") });

export function systemsRouter(ctx: AppContext): Router {
  const router = Router();

  /**
   * The system form's picker: the catalogue, then the company's own refrigerants not retired, each
   * with safety class, GWP on the company's bases and cautions.
   */
  router.get("/refrigerants", requireMember("stores.read"), async (req, res) => {
    const companyId = member(req).companyId;
    const [bases, own] = await Promise.all([companyGwpBases(ctx, companyId), companyRefrigerantsOf(ctx, companyId)]);
    const offered = [...REFRIGERANTS, ...own.filter((r) => !r.retired)];
    res.json({
      refrigerants: offered.map((r) => ({
        ...summarizeRefrigerant(r, bases),
        cautions: refrigerantCautions(r, bases.rules),
      })),
    });
  });

  router.get(
    "/stores/:storeId/systems",
    requireMember("stores.read"),
    validate(storeParam, "params"),
    validate(systemListQuery, "query"),
    async (req, res) => {
      const includeRetired = res.locals.query.include === "retired";
      res.json({ systems: await listSystems(ctx, member(req), res.locals.params.storeId, includeRetired) });
    },
  );

  router.post(
    "/stores/:storeId/systems",
    requireMember("stores.edit"),
    validate(storeParam, "params"),
    validate(systemInput),
    async (req, res) => {
      res
        .status(201)
        .json(await createSystem(ctx, member(req), req.auth!.user.id, res.locals.params.storeId, req.body));
    },
  );

  router.get("/systems/:id", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getSystem(ctx, member(req), res.locals.params.id));
  });

  router.patch(
    "/systems/:id",
    requireMember("stores.edit"),
    validate(idParam, "params"),
    validate(systemUpdateInput),
    async (req, res) => {
      res.json(await updateSystem(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  // Only a system no record names is deleted; one with records answers 409 and is retired instead.
  router.delete("/systems/:id", requireMember("stores.edit"), validate(idParam, "params"), async (req, res) => {
    res.json(await deleteSystem(ctx, member(req), res.locals.params.id));
  });

  router.post(
    "/systems/:id/retire",
    requireMember("stores.edit"),
    validate(idParam, "params"),
    validate(retireInput),
    async (req, res) => {
      res.json(await retireSystem(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  router.get("/systems/:id/revisions", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json({ revisions: await listRevisions(ctx, member(req), res.locals.params.id) });
  });

  // Engineers and owners change a system's dated facts; every figure keeps the values of its own date.
  router.post(
    "/systems/:id/revisions",
    requireMember("compliance.manage"),
    validate(idParam, "params"),
    validate(revisionInput),
    async (req, res) => {
      res.status(201).json(await addRevision(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  return router;
}
