import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { companyRefrigerantInput, companyRefrigerantRetiredInput } from "#core/contracts/company-refrigerants";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import {
  createCompanyRefrigerant,
  deleteCompanyRefrigerant,
  listCompanyRefrigerants,
  setCompanyRefrigerantRetired,
} from "./company-refrigerants.service";

const idParam = z.object({ id: z.uuid("must be a valid id") });

/** The company's own refrigerants: everyone who reads records sees them; owners and lead techs enter them. */
export function companyRefrigerantsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/company-refrigerants", requireMember("stores.read"), async (req, res) => {
    res.json({ refrigerants: await listCompanyRefrigerants(ctx, member(req).companyId) });
  });

  router.post(
    "/company-refrigerants",
    requireMember("stores.edit"),
    validate(companyRefrigerantInput),
    async (req, res) => {
      res.status(201).json(await createCompanyRefrigerant(ctx, member(req).companyId, req.auth!.user.id, req.body));
    },
  );

  // Retired or brought back; its facts never change once entered, so past figures never move.
  router.patch(
    "/company-refrigerants/:id",
    requireMember("stores.edit"),
    validate(idParam, "params"),
    validate(companyRefrigerantRetiredInput),
    async (req, res) => {
      res.json(
        await setCompanyRefrigerantRetired(
          ctx,
          member(req).companyId,
          req.auth!.user.id,
          res.locals.params.id,
          req.body.retired,
        ),
      );
    },
  );

  // Only while no system names it; otherwise 409 and the answer says to retire it.
  router.delete(
    "/company-refrigerants/:id",
    requireMember("stores.edit"),
    validate(idParam, "params"),
    async (req, res) => {
      await deleteCompanyRefrigerant(ctx, member(req).companyId, req.auth!.user.id, res.locals.params.id);
      res.status(204).end();
    },
  );

  return router;
}
